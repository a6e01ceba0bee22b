// Review meetings: members plan one with attendees and sheet revisions, record an outcome and
// notes per item; guests and other workspaces never see them.
import { describe, expect, it } from 'vitest';
import { useDatabase } from './support/database';
import { call } from './support/handlers';
import { matrixWorld } from './support/fixtures';
import * as meetings from '../../src/routes/api/meetings/+server';
import * as meeting from '../../src/routes/api/meetings/[id=uuid]/+server';
import * as items from '../../src/routes/api/meetings/[id=uuid]/items/+server';
import * as item from '../../src/routes/api/meetings/[id=uuid]/items/[itemId=uuid]/+server';
import * as activity from '../../src/routes/api/meetings/activity/+server';

useDatabase();

describe('review meetings', () => {
	it('plans a meeting, gathers revisions in order, records outcomes; outsiders and guests get 404', async () => {
		const w = await matrixWorld();
		const [{ sheet: a }, { sheet: b }] = [await w.sheet('Divider 10:1'), await w.sheet('TIA 100 kΩ')];
		const made = await call(meetings.POST, { user: w.member, method: 'POST', body: { workspaceId: w.workspace.id, title: 'Front-end review 14', heldOn: '2026-12-10', attendees: [w.owner.id, w.commenter.id] } });
		expect(made.status).toBe(201);
		const id = made.body.meeting.id;
		expect(made.body.meeting.attendees.map((p: { userId: string }) => p.userId).sort()).toEqual([w.owner.id, w.commenter.id].sort());
		const first = await call(items.POST, { user: w.member, params: { id }, method: 'POST', body: { sheetId: b.id } });
		await call(items.POST, { user: w.member, params: { id }, method: 'POST', body: { sheetId: a.id, revision: 1 } });
		const decided = await call(item.PATCH, { user: w.owner, params: { id, itemId: first.body.item.id }, method: 'PATCH', body: { outcome: 'rework', notes: 'Feedback C too small for the photodiode.' } });
		expect(decided.body.item).toMatchObject({ outcome: 'rework', notes: 'Feedback C too small for the photodiode.' });
		const read = (await call(meeting.GET, { user: w.viewer, params: { id } })).body.meeting;
		expect(read.items.map((i: { sheetName: string; position: number }) => [i.position, i.sheetName])).toEqual([[1, 'TIA 100 kΩ'], [2, 'Divider 10:1']]);

		expect((await call(meeting.GET, { user: w.guest, params: { id } })).status).toBe(404);
		expect((await call(meeting.GET, { user: w.outsider, params: { id } })).status).toBe(404);
		expect((await call(meetings.GET, { user: w.outsider, path: `/api/meetings?workspaceId=${w.workspace.id}` })).status).toBe(404);
		expect((await call(meetings.GET, { user: w.member, path: `/api/meetings?workspaceId=${w.workspace.id}` })).body.meetings).toEqual([
			{ id, title: 'Front-end review 14', heldOn: '2026-12-10', items: 2, decided: 1 }
		]);
		const feed = (await call(activity.GET, { user: w.member, path: `/api/meetings/activity?workspaceId=${w.workspace.id}` })).body.activity;
		expect(feed[0]).toMatchObject({ kind: 'meeting', detail: { title: 'Front-end review 14' } });
	});

	it('refuses attendees from outside, sheets of other workspaces, unknown outcomes and bad dates', async () => {
		const w = await matrixWorld();
		const made = await call(meetings.POST, { user: w.owner, method: 'POST', body: { workspaceId: w.workspace.id, title: 'R', heldOn: '2026-12-10' } });
		const id = made.body.meeting.id;
		expect((await call(meeting.PATCH, { user: w.owner, params: { id }, method: 'PATCH', body: { attendees: [w.guest.id] } })).body.error).toBe(
			`attendees: ${w.guest.id} is not a member of this workspace.`
		);
		const { sheet: foreign } = await (await import('../../src/lib/server/db/sheets')).createSheet({ userId: w.outsider.id, workspaceId: w.elsewhere.id, name: 'Theirs', document: { schema: 1, elements: [], input: 'V1', output: { node: 'a' } } });
		expect((await call(items.POST, { user: w.owner, params: { id }, method: 'POST', body: { sheetId: foreign.id } })).body.error).toBe('sheetId: no such sheet in this workspace.');
		expect((await call(meetings.POST, { user: w.owner, method: 'POST', body: { workspaceId: w.workspace.id, title: 'R', heldOn: '10.12.2026' } })).body.error).toBe('heldOn: heldOn must be a date like 2026-12-24');
		const { sheet } = await w.sheet();
		const it1 = await call(items.POST, { user: w.owner, params: { id }, method: 'POST', body: { sheetId: sheet.id } });
		expect((await call(item.PATCH, { user: w.owner, params: { id, itemId: it1.body.item.id }, method: 'PATCH', body: { outcome: 'maybe' } })).status).toBe(400);
		expect((await call(item.DELETE, { user: w.owner, params: { id, itemId: it1.body.item.id }, method: 'DELETE' })).status).toBe(204);
	});
});
