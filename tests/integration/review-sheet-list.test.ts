// The sheet list shows each sheet's review state in the sheet page's words — including a
// sheet signed off and then changed (issue 16, item 1: it used to say "draft") — and sorts and
// filters by it. The list and the sheet page must agree, so both are asked here.
import { describe, expect, it } from 'vitest';
import { useDatabase } from './support/database';
import { call } from './support/handlers';
import { matrixWorld, network, person } from './support/fixtures';
import { getRevision, saveRevision } from '../../src/lib/server/db/sheets';
import { setGrant } from '../../src/lib/server/db/grants';
import { addMember } from '../../src/lib/server/db/workspaces';
import * as reviews from '../../src/routes/api/sheets/[id=uuid]/reviews/+server';
import * as answer from '../../src/routes/api/sheets/[id=uuid]/reviews/[requestId=uuid]/answer/+server';
import * as list from '../../src/routes/api/workspaces/[id=uuid]/sheets/+server';

useDatabase();

type Who = { id: string; email: string; name: string };
type Row = { name: string; review: { state: string; label: string; approvedRevision: number | null; changedSinceApproval: boolean } };

async function save(userId: string, sheetId: string, document: unknown, layout: unknown = null) {
	const latest = (await getRevision(sheetId))!;
	return saveRevision(userId, sheetId, { document, layout }, latest.number);
}

async function world() {
	const w = await matrixWorld();
	const reviewer = await person('Piet Calloway');
	await addMember(w.workspace.id, reviewer.id, 'member');
	const ask = async (sheetId: string) => {
		await setGrant(sheetId, reviewer.id, 'commenter', w.owner.id);
		const made = await call(reviews.POST, { user: w.owner, params: { id: sheetId }, method: 'POST', body: { reviewers: [reviewer.id], message: '' } });
		return made.body.request.id as string;
	};
	const reply = (sheetId: string, requestId: string, decision: 'approve' | 'changes') =>
		call(answer.POST, { user: reviewer, params: { id: sheetId, requestId }, method: 'POST', body: { decision, summary: 'Checked the corner.' } });
	// Five sheets, one per state.
	const { sheet: fresh } = await w.sheet('A fresh');
	const { sheet: waiting } = await w.sheet('B waiting');
	await ask(waiting.id);
	const { sheet: changes } = await w.sheet('C changes');
	await reply(changes.id, await ask(changes.id), 'changes');
	const { sheet: signed } = await w.sheet('D signed');
	await reply(signed.id, await ask(signed.id), 'approve');
	// A layout-only save after sign-off changes nothing.
	await save(w.owner.id, signed.id, network('9M'), { items: [] });
	const { sheet: changed } = await w.sheet('E changed');
	await reply(changed.id, await ask(changed.id), 'approve');
	await save(w.owner.id, changed.id, network('9.1M'));
	return { ...w, fresh, waiting, changes, signed, changed };
}

const rows = async (user: Who, workspaceId: string, query = '') => {
	const res = await call(list.GET, { user, params: { id: workspaceId }, path: `/api/workspaces/${workspaceId}/sheets${query}` });
	expect(res.status).toBe(200);
	return res.body as { sheets: Row[]; total: number };
};

describe('review state in the sheet list', () => {
	it('says what the sheet page says, including a sheet changed since sign-off', async () => {
		const w = await world();
		const { sheets } = await rows(w.owner, w.workspace.id, '?sort=name');
		const by = Object.fromEntries(sheets.map((s) => [s.name, s.review]));
		expect(by['A fresh']).toMatchObject({ state: 'unreviewed', label: 'Not yet sent for review' });
		expect(by['B waiting']).toMatchObject({ state: 'waiting', label: 'With reviewers' });
		expect(by['C changes']).toMatchObject({ state: 'changes', label: 'Changes asked' });
		expect(by['D signed']).toMatchObject({ state: 'signed_off', approvedRevision: 1, changedSinceApproval: false });
		expect(by['E changed']).toMatchObject({ state: 'signed_off', approvedRevision: 1, changedSinceApproval: true });
		// The sheet page's own overview agrees, sheet by sheet.
		for (const s of [w.fresh, w.waiting, w.changes, w.signed, w.changed]) {
			const page = (await call(reviews.GET, { user: w.owner, params: { id: s.id } })).body.summary;
			const row = by[s.name];
			expect({ state: row.state, changed: row.changedSinceApproval }).toEqual({ state: page.state, changed: page.changedSinceApproval });
		}
	});

	it('filters by state, with "changed since sign-off" as its own choice', async () => {
		const w = await world();
		const names = async (state: string) => (await rows(w.owner, w.workspace.id, `?state=${state}`)).sheets.map((s) => s.name);
		expect(await names('changed')).toEqual(['E changed']);
		expect(await names('signed_off')).toEqual(['D signed']);
		expect(await names('changes')).toEqual(['C changes']);
		expect(await names('waiting')).toEqual(['B waiting']);
		expect(await names('unreviewed')).toEqual(['A fresh']);
		const bad = await call(list.GET, { user: w.owner, params: { id: w.workspace.id }, path: `/api/workspaces/${w.workspace.id}/sheets?state=draft` });
		expect(bad.status).toBe(400);
		expect(bad.body.error).toMatch(/state must be one of unreviewed, waiting, changes, changed, signed_off/);
	});

	it('sorts by state (ascending: not yet sent … signed off), and pages after sorting', async () => {
		const w = await world();
		const asc = (await rows(w.owner, w.workspace.id, '?sort=status&dir=asc')).sheets.map((s) => s.name);
		expect(asc).toEqual(['A fresh', 'B waiting', 'C changes', 'E changed', 'D signed']);
		const desc = (await rows(w.owner, w.workspace.id, '?sort=status&dir=desc')).sheets.map((s) => s.name);
		expect(desc).toEqual(['D signed', 'E changed', 'C changes', 'B waiting', 'A fresh']);
		const page2 = await rows(w.owner, w.workspace.id, '?sort=status&dir=asc&perPage=2&page=2');
		expect(page2.total).toBe(5);
		expect(page2.sheets.map((s) => s.name)).toEqual(['C changes', 'E changed']);
	});
});
