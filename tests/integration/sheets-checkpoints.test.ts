// Revision checkpoints (issue 16, item 2) against PostgreSQL: saves group into checkpoints with a
// summary of what changed; a revision a comment points at stays its own checkpoint; a name (and
// message) marks one; every save is still there.
import { describe, expect, it } from 'vitest';
import { useDatabase } from './support/database';
import { call } from './support/handlers';
import { matrixWorld, network } from './support/fixtures';
import { getRevision, saveRevision } from '../../src/lib/server/db/sheets';
import { checkpointsOf, nameRevisionAs } from '../../src/lib/server/sharing/sheet-actions';
import * as checkpoint from '../../src/routes/api/sheets/[id=uuid]/revisions/[n=revision]/checkpoint/+server';
import * as comments from '../../src/routes/api/sheets/[id=uuid]/comments/+server';

useDatabase();

async function save(userId: string, sheetId: string, document: unknown) {
	const latest = (await getRevision(sheetId))!;
	return saveRevision(userId, sheetId, { document }, latest.number);
}

describe('revision checkpoints', () => {
	it('groups saves, keeps referenced revisions apart, says what changed, and takes a name', async () => {
		const w = await matrixWorld();
		const { sheet } = await w.sheet('Checkpoint RC'); // revision 1 (R1 = 9M)
		await save(w.owner.id, sheet.id, network('9.1M')); // 2
		await save(w.owner.id, sheet.id, network('9.2M')); // 3
		// A comment written on revision 3 points at it.
		const c = await call(comments.POST, {
			user: w.owner,
			params: { id: sheet.id },
			method: 'POST',
			body: { body: 'Check the divider ratio here.' }
		});
		expect(c.status).toBe(201);
		await save(w.owner.id, sheet.id, network('9.3M')); // 4
		await save(w.owner.id, sheet.id, network('9.4M')); // 5

		let cps = await checkpointsOf(sheet.id);
		expect(cps.map((cp) => [cp.first, cp.number])).toEqual([
			[4, 5],
			[1, 3]
		]);
		expect(cps[1].referencedBy).toEqual(['comment']);
		expect(cps[0].summary).toBe('R1 9.2M → 9.4M');
		expect(cps.flatMap((cp) => cp.revisions.map((r) => r.number)).sort()).toEqual([1, 2, 3, 4, 5]);

		await nameRevisionAs(
			{ kind: 'user', id: w.owner.id },
			sheet.id,
			4,
			'first cut',
			'before the cable change'
		);
		cps = await checkpointsOf(sheet.id);
		expect(cps.find((cp) => cp.number === 4)).toMatchObject({
			name: 'first cut',
			message: 'before the cable change',
			first: 4
		});
		expect(cps[0]).toMatchObject({ first: 5, number: 5, summary: 'R1 9.3M → 9.4M' });

		// Naming needs the right to save; a viewer is refused.
		await expect(
			nameRevisionAs({ kind: 'user', id: w.viewer.id }, sheet.id, 4, 'mine', null)
		).rejects.toThrow();
	});

	it('the editor marks a checkpoint (Ctrl+S): the next saves start a new one; a viewer may not', async () => {
		const w = await matrixWorld();
		const { sheet } = await w.sheet('Explicit checkpoint RC'); // revision 1
		await save(w.owner.id, sheet.id, network('9.1M')); // 2
		await save(w.owner.id, sheet.id, network('9.2M')); // 3
		const mark = (user: typeof w.owner, n: number, body: object) =>
			call(checkpoint.POST, { user, params: { id: sheet.id, n: String(n) }, method: 'POST', body });
		const r = await mark(w.owner, 3, {});
		expect(r.status).toBe(200);
		expect(r.body.checkpoint).toEqual({ number: 3, name: null, message: null });
		await save(w.owner.id, sheet.id, network('9.3M')); // 4
		await save(w.owner.id, sheet.id, network('9.4M')); // 5
		expect((await checkpointsOf(sheet.id)).map((cp) => [cp.first, cp.number])).toEqual([
			[4, 5],
			[1, 3]
		]);
		// With words: the name and message are kept with the mark.
		expect((await mark(w.owner, 5, { name: 'bench 2', message: 'cable 1.2 m' })).status).toBe(200);
		expect((await checkpointsOf(sheet.id))[0]).toMatchObject({
			number: 5,
			name: 'bench 2',
			message: 'cable 1.2 m'
		});
		expect((await mark(w.viewer, 5, {})).status).toBe(403);
		expect((await mark(w.owner, 9, {})).status).toBe(404);
		expect((await mark(w.owner, 5, { name: 'x'.repeat(81) })).status).toBe(400);
	});
});
