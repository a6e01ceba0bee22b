// The design aids on a network sent with the request (the drawing as it is now, unsaved edits
// included) rather than a stored revision: the same front door as POST /api/analyze (size and
// shape, the element at fault named), and a Monte Carlo job that runs on what was sent, records
// the revision it was based on, and leaves the sheet's revisions alone.
import { afterAll, describe, expect, it } from 'vitest';
import { useDatabase } from './support/database';
import { dividerSheet } from './design-helpers';
import { call } from './support/handlers';
import { listRevisions } from '../../src/lib/server/db/sheets';
import { digitizerDivider } from '../../src/lib/server/db/seed/demo-sheets';
import { LIMITS } from '../../src/lib/server/analysis-request';
import { closeDesignPool } from '../../src/lib/server/jobs/design-pool';
import { stopJobRunner } from '../../src/lib/server/jobs/all-kinds';
import * as sens from '../../src/routes/api/design/sensitivity/+server';
import * as sweep from '../../src/routes/api/design/sweep/+server';
import * as mc from '../../src/routes/api/design/monte-carlo/+server';
import * as job from '../../src/routes/api/design/jobs/[id=uuid]/+server';
import * as jobs from '../../src/routes/api/design/sheets/[id=uuid]/jobs/+server';

useDatabase();
afterAll(async () => {
	await stopJobRunner();
	await closeDesignPool();
});

/** The demo divider with one value changed, as the editor would send it before saving. */
const edited = (id: string, value: string) => ({
	...digitizerDivider,
	elements: digitizerDivider.elements.map((e) => (e.id === id ? { ...e, value } : e))
});

const world = dividerSheet;

type User = { id: string; email: string; name: string };
async function finished(user: User, id: string) {
	const end = Date.now() + 60_000;
	for (;;) {
		const r = await call(job.GET, { user, params: { id } });
		const j = r.body.job;
		if (j.state === 'done' || j.state === 'failed' || Date.now() > end) return j;
		await new Promise((ok) => setTimeout(ok, 150));
	}
}

// Flat within 0.1 dB from 10 Hz to 1 MHz, with Rtop held to 0.1 %.
const run = {
	runs: 200,
	seed: 9,
	tolerances: [{ element: 'Rtop', tolerance: 0.001, distribution: 'uniform' }],
	spec: { flatness: { withinDb: 0.1, fLo: 10, fHi: 1e6 } }
};

describe('design aids on a sent network', () => {
	it('a network with an error is refused naming the element: 400 for its shape, 422 for its value', async () => {
		const { ana, sheet } = await world();
		const shape = {
			...digitizerDivider,
			elements: [...digitizerDivider.elements, { id: 'Rx', type: 'Q', nodes: ['adc', 'gnd'] }]
		};
		for (const [handler, body] of [
			[sens.POST, { document: shape }],
			[mc.POST, { sheetId: sheet.id, ...run, document: shape }]
		] as const) {
			const r = await call(handler, { user: ana, method: 'POST', body });
			expect(r.status).toBe(400);
			expect(r.body).toMatchObject({ code: 'bad_document', element: 'Rx' });
			expect(r.body.error).toMatch(/^element "Rx"/);
		}
		// A value the solver cannot read: what a half-typed edit would send.
		const value = edited('Ctop', '6.8 furlongs');
		for (const [handler, body] of [
			[sens.POST, { document: value }],
			[mc.POST, { sheetId: sheet.id, ...run, document: value }]
		] as const) {
			const r = await call(handler, { user: ana, method: 'POST', body });
			expect(r.status).toBe(422);
			expect(r.body.element).toBe('Ctop');
		}
		// Nothing was queued for the refused runs.
		expect((await call(jobs.GET, { user: ana, params: { id: sheet.id } })).body.jobs).toEqual([]);
	});

	it('the network is held to /api/analyze’s size limit (413), even inside a larger body limit', async () => {
		const { ana, sheet } = await world();
		const big = { ...digitizerDivider, title: 'x'.repeat(LIMITS.bodyBytes + 10) };
		const a = await call(sweep.POST, {
			user: ana,
			method: 'POST',
			body: { document: big, axes: [{ element: 'Ctop', from: 5e-12, to: 8e-12, points: 3 }] }
		});
		expect(a.status).toBe(413);
		expect(a.body.error).toMatch(/^document: the network is \d+ bytes; the limit is 1000000/);
		const b = await call(mc.POST, {
			user: ana,
			method: 'POST',
			body: { sheetId: sheet.id, ...run, document: big }
		});
		expect(b.status).toBe(413);
	});

	it('Monte Carlo runs on the sent drawing, records the revision it is based on, and saves nothing', async () => {
		const { ana, eve, sheet } = await world();
		// Saved: Ctop 6.8 pF, 0.17 dB of lift, so no run is flat within 0.1 dB. The drawing has
		// Ctop at the compensating 6.6667 pF (1 MΩ × 60 pF / 9 MΩ, closed form for the arms).
		const onDrawing = await call(mc.POST, {
			user: ana,
			method: 'POST',
			body: { sheetId: sheet.id, ...run, revision: 1, document: edited('Ctop', '6.6667p') }
		});
		expect(onDrawing.status).toBe(202);
		expect(onDrawing.body.job).toMatchObject({ source: 'drawing', revision: 1, state: 'queued' });
		// The sent network stays in the job for the runner, out of every answer.
		expect(onDrawing.body.job.request.document).toBeUndefined();
		const onSaved = await call(mc.POST, {
			user: ana,
			method: 'POST',
			body: { sheetId: sheet.id, ...run }
		});
		expect(onSaved.body.job).toMatchObject({ source: 'revision', revision: 1 });
		const [d, s] = [
			await finished(ana, onDrawing.body.job.id),
			await finished(ana, onSaved.body.job.id)
		];
		expect([d.state, s.state]).toEqual(['done', 'done']);
		expect(d.result).toMatchObject({ source: 'drawing', revision: 1, runs: 200 });
		expect(d.result.yield.fraction).toBe(1);
		expect(d.result.nominal.flatnessDb).toBeLessThan(0.02);
		expect(s.result).toMatchObject({ source: 'revision', revision: 1 });
		expect(s.result.yield.fraction).toBe(0);
		expect(s.result.nominal.flatnessDb).toBeGreaterThan(0.1);
		expect(await listRevisions(sheet.id)).toHaveLength(1);
		// Sending a network does not get round the sheet's access rules.
		const other = await call(mc.POST, {
			user: eve,
			method: 'POST',
			body: { sheetId: sheet.id, ...run, document: edited('Ctop', '6.6667p') }
		});
		expect(other.status).toBe(404);
	}, 90_000);
});
