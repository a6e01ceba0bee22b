// Saves through PUT /api/sheets/:id/revisions: two at once on one base (exactly one wins, the
// other gets 409 with the winner, and re-saving on top keeps both contents), restore as a new
// revision, read-only old revisions, and the analysis of a stored revision.
import { describe, expect, it } from 'vitest';
import { useDatabase } from './support/database';
import { call } from './support/handlers';
import { network, person } from './support/fixtures';
import { createWorkspace } from '../../src/lib/server/db/workspaces';
import { createSheet } from '../../src/lib/server/db/sheets';
import * as revisions from '../../src/routes/api/sheets/[id=uuid]/revisions/+server';
import * as revision from '../../src/routes/api/sheets/[id=uuid]/revisions/[n=revision]/+server';
import * as restore from '../../src/routes/api/sheets/[id=uuid]/revisions/[n=revision]/restore/+server';
import * as analysis from '../../src/routes/api/sheets/[id=uuid]/revisions/[n=revision]/analysis/+server';

useDatabase();

async function world() {
	const [ana, ben] = [await person('Ana'), await person('Ben')];
	const ws = await createWorkspace(ana.id, 'Bench');
	const { addMember } = await import('../../src/lib/server/db/workspaces');
	await addMember(ws.id, ben.id, 'member'); // default sheet role: editor
	const { sheet } = await createSheet({ userId: ana.id, workspaceId: ws.id, name: 'RC', document: network('1k') });
	return { ana, ben, sheet };
}

const put = (user: { id: string; email: string; name: string }, id: string, baseRevision: number, r: string) =>
	call(revisions.PUT, { user, params: { id }, method: 'PUT', body: { baseRevision, document: network(r), message: `R1 = ${r}` } });

describe('saving revisions', () => {
	it('two saves on the same base: exactly one 201, the other 409 with the latest; both contents kept after re-saving', async () => {
		const { ana, ben, sheet } = await world();
		const results = await Promise.all([put(ana, sheet.id, 1, '2k'), put(ben, sheet.id, 1, '3k')]);
		expect(results.map((r) => r.status).sort()).toEqual([201, 409]);
		const loser = results.find((r) => r.status === 409)!;
		const winner = results.find((r) => r.status === 201)!;
		expect(loser.body.latest.number).toBe(2);
		expect(loser.body.latest.document).toEqual(winner.body.revision.document);
		expect(loser.body.error).toMatch(/revision 2/);
		// The loser merges nothing away: it saves its own content on top of the winner.
		const loserUser = results[0] === loser ? ana : ben;
		const loserValue = results[0] === loser ? '2k' : '3k';
		expect((await put(loserUser, sheet.id, 2, loserValue)).status).toBe(201);
		const r2 = await call(revision.GET, { user: ana, params: { id: sheet.id, n: '2' } });
		const r3 = await call(revision.GET, { user: ana, params: { id: sheet.id, n: '3' } });
		const values = [r2.body.revision.document.elements[1].value, r3.body.revision.document.elements[1].value].sort();
		expect(values).toEqual(['2k', '3k']);
		const history = await call(revisions.GET, { user: ben, params: { id: sheet.id } });
		expect(history.body.revisions.map((r: { number: number }) => r.number)).toEqual([3, 2, 1]);
		expect(history.body.revisions[2].authorName).toBe('Ana');
	});

	it('rejects a save without baseRevision (400) and a document over the body limit (413)', async () => {
		const { ana, sheet } = await world();
		const missing = await call(revisions.PUT, { user: ana, params: { id: sheet.id }, method: 'PUT', body: { document: network('1k') } });
		expect(missing.status).toBe(400);
		expect(missing.body.error).toMatch(/baseRevision/);
		const huge = await call(revisions.PUT, { user: ana, params: { id: sheet.id }, method: 'PUT', rawBody: JSON.stringify({ baseRevision: 1, document: network('x'.repeat(2_100_000)) }) });
		expect(huge.status).toBe(413);
		const badJson = await call(revisions.PUT, { user: ana, params: { id: sheet.id }, method: 'PUT', rawBody: '{"baseRevision": 1,' });
		expect(badJson.status).toBe(400);
		expect(badJson.body.error).toMatch(/not valid JSON/);
	});

	it('restoring an old revision adds a new one with its content; the old ones stay as they were', async () => {
		const { ana, sheet } = await world();
		await put(ana, sheet.id, 1, '2k');
		const restored = await call(restore.POST, { user: ana, params: { id: sheet.id, n: '1' }, method: 'POST', body: {} });
		expect(restored.status).toBe(201);
		expect(restored.body.revision.number).toBe(3);
		expect(restored.body.revision.document).toEqual(network('1k'));
		expect(restored.body.revision.message).toBe('Restored revision 1');
		const two = await call(revision.GET, { user: ana, params: { id: sheet.id, n: '2' } });
		expect(two.body.revision.document).toEqual(network('2k'));
		// A restore on a stale base is a conflict like any other save.
		const stale = await call(restore.POST, { user: ana, params: { id: sheet.id, n: '2' }, method: 'POST', body: { baseRevision: 2 } });
		expect(stale.status).toBe(409);
		expect(stale.body.latest.number).toBe(3);
		expect((await call(revision.GET, { user: ana, params: { id: sheet.id, n: '9' } })).status).toBe(404);
	});

	it('analyzes a stored revision: the RC low-pass has its one pole at −1/(RC)', async () => {
		const { ana, sheet } = await world();
		const result = await call(analysis.GET, { user: ana, params: { id: sheet.id, n: '1' } });
		expect(result.status).toBe(200);
		expect(result.body.revision).toBe(1);
		// Closed form: a first-order RC low-pass has one real pole at s = −1/(RC); R = 1 kΩ,
		// C = 1 nF → −1e6 rad/s.
		const poles = result.body.analysis.poles as { re: number; im: number }[];
		expect(poles).toHaveLength(1);
		expect(Math.abs(poles[0].re + 1e6) / 1e6).toBeLessThan(1e-9);
	});

	it('answers 422 with the solver’s code when a stored network cannot be analyzed', async () => {
		const { ana, sheet } = await world();
		const broken = { ...network('1k'), elements: [...network('1k').elements, { id: 'R9', type: 'R', nodes: ['b', 'gnd'], value: '0' }] };
		expect((await call(revisions.PUT, { user: ana, params: { id: sheet.id }, method: 'PUT', body: { baseRevision: 1, document: broken } })).status).toBe(201);
		const result = await call(analysis.GET, { user: ana, params: { id: sheet.id, n: '2' } });
		expect(result.status).toBe(422);
		expect(result.body.code).toBe('zero_value');
		expect(result.body.element).toBe('R9');
	});
});
