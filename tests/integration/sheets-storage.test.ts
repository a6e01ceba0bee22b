import { describe, expect, it } from 'vitest';
import { useDatabase } from './support/database';
import { models } from '../../src/lib/server/db/models';
import { createSheet, getRevision, listRevisions, RevisionConflict, saveRevision } from '../../src/lib/server/db/sheets';
import { seedDemo } from '../../src/lib/server/db/seed';

useDatabase();

async function owner() {
	const { User, Workspace } = models();
	const user = await User.create({ email: 'ana@example.test', name: 'Ana', passwordHash: null });
	const workspace = await Workspace.create({ name: 'Bench' });
	return { userId: user.id, workspaceId: workspace.id };
}

const doc = (value: string) => ({
	schema: 1,
	elements: [
		{ id: 'V1', type: 'V', nodes: ['a', 'gnd'], value: 1 },
		{ id: 'R1', type: 'R', nodes: ['a', 'b'], value },
		{ id: 'C1', type: 'C', nodes: ['b', 'gnd'], value: '1n' }
	],
	input: 'V1',
	output: { node: 'b' }
});

describe('sheet storage through Sequelize on PostgreSQL', () => {
	it('writes a sheet with its first revision and reads the JSONB document back unchanged', async () => {
		const who = await owner();
		const { sheet, revision } = await createSheet({ ...who, name: 'RC corner', document: doc('1k') });
		expect(sheet.latestRevision).toBe(1);
		const read = await getRevision(sheet.id);
		expect(read?.id).toBe(revision.id);
		expect(read?.document).toEqual(doc('1k'));
	});

	it('numbers revisions and refuses a save based on a stale revision with the latest one', async () => {
		const who = await owner();
		const { sheet } = await createSheet({ ...who, name: 'RC corner', document: doc('1k') });
		const second = await saveRevision(who.userId, sheet.id, { document: doc('2k') }, 1);
		expect(second.number).toBe(2);
		const stale = saveRevision(who.userId, sheet.id, { document: doc('3k') }, 1);
		await expect(stale).rejects.toBeInstanceOf(RevisionConflict);
		await expect(stale).rejects.toMatchObject({ latest: { number: 2 } });
		expect((await listRevisions(sheet.id)).map((r) => r.number)).toEqual([2, 1]);
	});

	it('seeds the demo workspace once: a second run changes nothing', async () => {
		expect(await seedDemo()).toEqual({ created: true });
		const { Sheet, User } = models();
		const counts = async () => [await User.count(), await Sheet.count()];
		const first = await counts();
		expect(first[1]).toBeGreaterThanOrEqual(3);
		expect(await seedDemo()).toEqual({ created: false });
		expect(await counts()).toEqual(first);
	});
});
