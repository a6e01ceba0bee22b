// Design aids through their SvelteKit handlers, with the real design worker pool and the real
// pg-boss queue on PostgreSQL: sync endpoints, spec limits stored with a sheet, and Monte Carlo
// as a background job (progress, result stored with its revision, cancel, access).
import { afterAll, describe, expect, it } from 'vitest';
import type { RequestEvent } from '@sveltejs/kit';
import { useDatabase } from './support/database';
import { dividerSheet } from './design-helpers';
import { call } from './support/handlers';
import { digitizerDivider } from '../../src/lib/server/db/seed/demo-sheets';
import { closeDesignPool } from '../../src/lib/server/jobs/design-pool';
import { stopJobRunner } from '../../src/lib/server/jobs/all-kinds';
import * as solve from '../../src/routes/api/design/solve/+server';
import * as sweep from '../../src/routes/api/design/sweep/+server';
import * as sens from '../../src/routes/api/design/sensitivity/+server';
import * as worst from '../../src/routes/api/design/worst-case/+server';
import * as mc from '../../src/routes/api/design/monte-carlo/+server';
import * as job from '../../src/routes/api/design/jobs/[id=uuid]/+server';
import * as cancel from '../../src/routes/api/design/jobs/[id=uuid]/cancel/+server';
import * as jobs from '../../src/routes/api/design/sheets/[id=uuid]/jobs/+server';
import * as settings from '../../src/routes/api/design/sheets/[id=uuid]/settings/+server';
import * as spec from '../../src/routes/api/design/sheets/[id=uuid]/spec/+server';

useDatabase();
afterAll(async () => {
	await stopJobRunner();
	await closeDesignPool();
});

const world = dividerSheet;

async function waitFor(
	user: { id: string; email: string; name: string },
	id: string,
	until: (j: { state: string; done: number }) => boolean,
	ms = 60_000
) {
	const end = Date.now() + ms;
	for (;;) {
		const r = await call(job.GET, { user, params: { id } });
		if (until(r.body.job) || Date.now() > end) return r.body.job;
		await new Promise((ok) => setTimeout(ok, 100));
	}
}

describe('design aids API', () => {
	it('solve: the demo divider’s trimmer comes out near R·C/R (6.67 pF) with E24 neighbours', async () => {
		const { ana } = await world();
		const r = await call(solve.POST, {
			user: ana,
			method: 'POST',
			body: { document: digitizerDivider, element: 'Ctop', goal: { kind: 'flat' } }
		});
		expect(r.status).toBe(200);
		expect(r.body.value).toBeGreaterThan(6.6e-12);
		expect(r.body.value).toBeLessThan(6.75e-12);
		expect(r.body.preferred.above.value).toBeCloseTo(6.8e-12, 18);
	});

	it('sync endpoints answer 401 signed out, 400 naming the field, 422 naming the element', async () => {
		const { ana } = await world();
		expect(
			(await call(sens.POST, { method: 'POST', body: { document: digitizerDivider } })).status
		).toBe(401);
		const bad = await call(solve.POST, {
			user: ana,
			method: 'POST',
			body: { document: digitizerDivider, element: 'Ctop', goal: { kind: 'bandwidth', target: -1 } }
		});
		expect(bad.status).toBe(400);
		expect(bad.body.error).toMatch(/goal\.target/);
		const unknown = await call(sweep.POST, {
			user: ana,
			method: 'POST',
			body: {
				document: digitizerDivider,
				axes: [{ element: 'Cx', from: 1e-12, to: 1e-11, points: 5 }]
			}
		});
		expect(unknown.status).toBe(422);
		expect(unknown.body).toMatchObject({ code: 'unknown_element', element: 'Cx' });
		const noDoc = await call(sens.POST, {
			user: ana,
			method: 'POST',
			body: {
				document: {
					schema: 1,
					elements: [{ id: 'R1', type: 'Q', nodes: ['a', 'b'] }],
					input: 'V',
					output: { node: 'a' }
				}
			}
		});
		expect(noDoc.status).toBe(400);
		expect(noDoc.body.element).toBe('R1');
	});

	it('sweep as CSV, and worst case by corners', async () => {
		const { ana } = await world();
		// The CSV answer is text, so this one call builds its own event.
		const url = new URL('http://127.0.0.1/api/design/sweep?format=csv');
		const body = {
			document: digitizerDivider,
			axes: [{ element: 'Ctop', from: 5e-12, to: 8e-12, points: 4, scale: 'linear' }]
		};
		const request = new Request(url, {
			method: 'POST',
			headers: { 'content-type': 'application/json' },
			body: JSON.stringify(body)
		});
		const res = await sweep.POST({
			request,
			url,
			params: {},
			locals: { user: ana, session: null, auth: 'session' }
		} as unknown as RequestEvent);
		expect(res.status).toBe(200);
		expect(res.headers.get('content-type')).toMatch(/^text\/csv/);
		const lines = (await res.text()).trim().split('\r\n');
		expect(lines).toHaveLength(5);
		expect(lines[0]).toMatch(/^Ctop,dc_gain,bandwidth_hz/);
		const w = await call(worst.POST, {
			user: ana,
			method: 'POST',
			body: {
				document: digitizerDivider,
				method: 'corners',
				tolerances: [
					{ element: 'Rtop', tolerance: 0.01, distribution: 'uniform' },
					{ element: 'Radc', tolerance: 0.01, distribution: 'uniform' }
				]
			}
		});
		expect(w.status).toBe(200);
		// DC gain extremes: Radc/(Rtop + Rsrc + Radc) at the opposite corners (closed form).
		const g = w.body.figures.find((f: { figure: string }) => f.figure === 'dcGain');
		expect(g.max.value).toBeCloseTo(1.01e6 / (8.91e6 + 50 + 1.01e6), 12);
	});

	it('spec limits are stored with the sheet, judged per revision, and only editors may change them', async () => {
		const { ana, eve, sheet } = await world();
		const body = {
			spec: { dcGain: { min: 0.099, max: 0.101 }, flatness: { withinDb: 0.05, fLo: 10, fHi: 1e6 } },
			tolerances: {
				elements: [{ element: 'Ctop', tolerance: 0.05, distribution: 'uniform' }],
				runs: 200,
				seed: 5
			}
		};
		expect(
			(await call(settings.PUT, { user: eve, method: 'PUT', params: { id: sheet.id }, body }))
				.status
		).toBe(404);
		const bad = await call(settings.PUT, {
			user: ana,
			method: 'PUT',
			params: { id: sheet.id },
			body: { ...body, spec: { flatness: { withinDb: 1, fLo: 10, fHi: 1 } } }
		});
		expect(bad.status).toBe(400);
		expect(bad.body.error).toMatch(/^spec\.flatness\.fHi/);
		expect(
			(await call(settings.PUT, { user: ana, method: 'PUT', params: { id: sheet.id }, body }))
				.status
		).toBe(200);
		expect(
			(await call(settings.GET, { user: ana, params: { id: sheet.id } })).body.settings
		).toEqual(body);
		const judged = await call(spec.GET, {
			user: ana,
			params: { id: sheet.id },
			path: '/x?revision=1'
		});
		expect(judged.status).toBe(200);
		expect(judged.body.revision).toBe(1);
		// The demo divider is a little over-compensated (6.8 pF against 6.67 pF): 0.17 dB of lift.
		expect(judged.body.checks.map((c: { key: string; pass: boolean }) => [c.key, c.pass])).toEqual([
			['flatness', false],
			['dcGain', true]
		]);
	});

	it('Monte Carlo runs as a background job: progress, yield, result stored with its revision, visible after a reload', async () => {
		const { ana, eve, sheet } = await world();
		await call(settings.PUT, {
			user: ana,
			method: 'PUT',
			params: { id: sheet.id },
			body: {
				spec: { flatness: { withinDb: 0.3, fLo: 10, fHi: 1e6 } },
				tolerances: {
					elements: [{ element: 'Ctop', tolerance: 0.1, distribution: 'uniform' }],
					runs: 1000,
					seed: 11
				}
			}
		});
		const started = await call(mc.POST, { user: ana, method: 'POST', body: { sheetId: sheet.id } });
		expect(started.status).toBe(202);
		expect(started.body.job).toMatchObject({ state: 'queued', revision: 1, total: 1000 });
		const id = started.body.job.id;
		expect((await call(job.GET, { user: eve, params: { id } })).status).toBe(404);
		const done = await waitFor(ana, id, (j) => j.state === 'done' || j.state === 'failed');
		expect(done.state).toBe('done');
		expect(done.done).toBe(1000);
		expect(done.result.revision).toBe(1);
		expect(done.result.runs).toBe(1000);
		expect(done.result.yield.fraction).toBeGreaterThan(0);
		expect(done.result.yield.fraction).toBeLessThan(1);
		const list = await call(jobs.GET, { user: ana, params: { id: sheet.id } });
		expect(list.body.jobs.map((j: { id: string }) => j.id)).toContain(id);
		// Same seed, same request: the same numbers (reproducible runs).
		const again = await call(mc.POST, { user: ana, method: 'POST', body: { sheetId: sheet.id } });
		const second = await waitFor(
			ana,
			again.body.job.id,
			(j) => j.state === 'done' || j.state === 'failed'
		);
		expect(second.result.figures).toEqual(done.result.figures);
	});

	it('a running Monte Carlo can be cancelled and stops early; a refused request says why', async () => {
		const { ana, sheet } = await world();
		const none = await call(mc.POST, { user: ana, method: 'POST', body: { sheetId: sheet.id } });
		expect(none.status).toBe(400);
		expect(none.body.error).toMatch(/at least one element a tolerance/);
		const unknown = await call(mc.POST, {
			user: ana,
			method: 'POST',
			body: {
				sheetId: sheet.id,
				tolerances: [{ element: 'Cx', tolerance: 0.1, distribution: 'uniform' }]
			}
		});
		expect(unknown.status).toBe(422);
		const started = await call(mc.POST, {
			user: ana,
			method: 'POST',
			body: {
				sheetId: sheet.id,
				runs: 10000,
				seed: 2,
				tolerances: [
					{ element: 'Ctop', tolerance: 0.1, distribution: 'normal' },
					{ element: 'Ccable', tolerance: 0.1, distribution: 'uniform' }
				]
			}
		});
		const id = started.body.job.id;
		await waitFor(ana, id, (j) => j.done > 0);
		const c = await call(cancel.POST, { user: ana, method: 'POST', params: { id } });
		expect(c.status).toBe(200);
		const end = await waitFor(ana, id, (j) => j.state !== 'running' && j.state !== 'queued');
		expect(end.state).toBe('cancelled');
		expect(end.done).toBeLessThan(10000);
		expect(end.result).toBeNull();
	});
});
