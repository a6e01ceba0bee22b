// Comments through the real API handlers and PostgreSQL: anchors that survive later revisions
// (and say when the part they point at changed or went away), threads, resolve, edit/delete
// rules, and mentions that reach the fake inbox and the in-app list.
import { describe, expect, it } from 'vitest';
import { useDatabase } from './support/database';
import { call } from './support/handlers';
import { matrixWorld, network, person } from './support/fixtures';
import { inboxFor } from './support/auth-helpers';
import { getRevision, saveRevision } from '../../src/lib/server/db/sheets';
import { setGrant } from '../../src/lib/server/db/grants';
import { addMember } from '../../src/lib/server/db/workspaces';
import * as comments from '../../src/routes/api/sheets/[id=uuid]/comments/+server';
import * as oneComment from '../../src/routes/api/sheets/[id=uuid]/comments/[commentId=uuid]/+server';
import * as people from '../../src/routes/api/sheets/[id=uuid]/comments/people/+server';
import * as notifications from '../../src/routes/api/notifications/+server';
import * as readNotifications from '../../src/routes/api/notifications/read/+server';

useDatabase();

type Doc = ReturnType<typeof network>;
const withC1 = (doc: Doc, value: string | null): Doc => ({
	...doc,
	elements: value === null ? doc.elements.filter((e) => e.id !== 'C1') : doc.elements.map((e) => (e.id === 'C1' ? { ...e, value } : e))
});

async function save(userId: string, sheetId: string, document: unknown, layout: unknown = null) {
	const latest = (await getRevision(sheetId))!;
	return saveRevision(userId, sheetId, { document, layout }, latest.number);
}

const post = (user: { id: string; email: string; name: string }, sheetId: string, body: unknown) =>
	call(comments.POST, { user, params: { id: sheetId }, method: 'POST', body, path: `/api/sheets/${sheetId}/comments` });

const statusOf = (threads: { id: string; anchorStatus: string }[], id: string) => threads.find((t) => t.id === id)?.anchorStatus;

describe('comment anchors across revisions', () => {
	it('a comment on C1 stays current while other parts change, then says C1 changed, then that it is gone', async () => {
		const world = await matrixWorld();
		const { sheet } = await world.sheet();
		const onC1 = await post(world.commenter, sheet.id, { body: 'Is **C1** the right dielectric?', anchor: { kind: 'element', ref: 'C1' } });
		expect(onC1.status).toBe(201);
		expect(onC1.body.comment).toMatchObject({ revisionNumber: 1, anchorKind: 'element', anchorRef: 'C1', bodyHtml: '<p>Is <strong>C1</strong> the right dielectric?</p>' });
		const onNet = await post(world.commenter, sheet.id, { body: 'Probe here', anchor: { kind: 'net', ref: 'b' } });
		const onPole = await post(world.commenter, sheet.id, { body: 'p1 is low', anchor: { kind: 'pole', ref: 'p1', snapshot: { re: -111, im: 0, hz: 17.7, owners: ['C1'] } } });
		const onSheet = await post(world.commenter, sheet.id, { body: 'Overall fine' });
		const ids = { c1: onC1.body.comment.id, net: onNet.body.comment.id, pole: onPole.body.comment.id, sheet: onSheet.body.comment.id };

		const list = async () => (await call(comments.GET, { user: world.viewer, params: { id: sheet.id } })).body;
		let now = await list();
		expect(Object.values(ids).map((id) => statusOf(now.threads, id))).toEqual(['current', 'current', 'current', 'current']);

		// Revision 2 changes R1 only: the C1 and net comments still point at what they meant; the
		// pole comment is about results of an earlier network.
		await save(world.owner.id, sheet.id, network('10M'));
		now = await list();
		expect(now.latestRevision).toBe(2);
		expect([statusOf(now.threads, ids.c1), statusOf(now.threads, ids.net), statusOf(now.threads, ids.pole), statusOf(now.threads, ids.sheet)]).toEqual([
			'current',
			'current',
			'changed',
			'current'
		]);

		// Revision 3 changes C1 itself; the comment keeps revision 1 (the page links there).
		await save(world.owner.id, sheet.id, withC1(network('10M'), '2n'));
		now = await list();
		const c1 = now.threads.find((t: { id: string }) => t.id === ids.c1);
		expect(c1).toMatchObject({ anchorStatus: 'changed', revisionNumber: 1, anchorSnapshot: { type: 'C', value: '1n', nodes: ['b', 'gnd'] } });

		// Revision 4 deletes C1: its comment still shows, marked removed; net b lives on through R1.
		await save(world.owner.id, sheet.id, withC1(network('10M'), null));
		now = await list();
		expect(now.threads).toHaveLength(4);
		expect([statusOf(now.threads, ids.c1), statusOf(now.threads, ids.net)]).toEqual(['removed', 'current']);
		// Revision 5 replaces R1 by R9: no part that was on net b is left (net names do not count,
		// the editor gives them afresh; what the terminals touch does).
		const replaced = withC1(network('10M'), null);
		replaced.elements = replaced.elements.map((e) => (e.id === 'R1' ? { ...e, id: 'R9', nodes: ['a', 'out'] } : e));
		await save(world.owner.id, sheet.id, { ...replaced, output: { node: 'out' } });
		expect(statusOf((await list()).threads, ids.net)).toBe('removed');
	});

	it('a layout-only save moves nothing a comment points at; replies join the thread with its anchor', async () => {
		const world = await matrixWorld();
		const { sheet } = await world.sheet();
		const first = await post(world.commenter, sheet.id, { body: 'τ of C1?', anchor: { kind: 'time_constant', ref: 'C1' } });
		const pole = await post(world.commenter, sheet.id, { body: 'dominant', anchor: { kind: 'pole', ref: 'p1' } });
		await save(world.owner.id, sheet.id, network('9M'), { items: [{ id: 'x', x: 40, y: 80 }] });
		const reply = await post(world.editor, sheet.id, { body: 'About 9 ms', parentId: first.body.comment.id, anchor: { kind: 'element', ref: 'R1' } });
		expect(reply.status).toBe(201);
		expect(reply.body.comment).toMatchObject({ parentId: first.body.comment.id, anchorKind: 'time_constant', anchorRef: 'C1', revisionNumber: 2 });
		// A reply to a reply lands on the thread's first comment (threads are one level deep).
		const deeper = await post(world.owner, sheet.id, { body: 'agreed', parentId: reply.body.comment.id });
		expect(deeper.body.comment.parentId).toBe(first.body.comment.id);
		const { threads } = (await call(comments.GET, { user: world.owner, params: { id: sheet.id } })).body;
		expect(threads.map((t: { replies: unknown[] }) => t.replies.length)).toEqual([2, 0]);
		expect(statusOf(threads, pole.body.comment.id)).toBe('current');
	});

	it('refuses anchors that the revision does not have, naming them', async () => {
		const world = await matrixWorld();
		const { sheet } = await world.sheet();
		const bad = await post(world.commenter, sheet.id, { body: 'x', anchor: { kind: 'element', ref: 'C9' } });
		expect(bad.status).toBe(400);
		expect(bad.body.error).toBe('anchor.ref: revision 1 has no element "C9"');
		expect((await post(world.commenter, sheet.id, { body: 'x', anchor: { kind: 'net', ref: 'zz' } })).body.error).toContain('no net "zz"');
		expect((await post(world.commenter, sheet.id, { body: '   ' })).body.error).toBe('body: body is empty: write something');
		expect((await post(world.commenter, sheet.id, { body: 'x', revision: 7 })).body.error).toBe('revision: the sheet has no revision 7.');
		expect((await post(world.commenter, sheet.id, { body: 'x'.repeat(4001) })).status).toBe(400);
	});
});

describe('net names given afresh', () => {
	it('a save that only renames nets (as the editor does) changes no anchor, and "1n" equals "1 n"', async () => {
		const world = await matrixWorld();
		const { sheet } = await world.sheet();
		const onC1 = await post(world.commenter, sheet.id, { body: 'C1?', anchor: { kind: 'element', ref: 'C1' } });
		const onNet = await post(world.commenter, sheet.id, { body: 'b?', anchor: { kind: 'net', ref: 'b' } });
		const onPole = await post(world.commenter, sheet.id, { body: 'p1?', anchor: { kind: 'pole', ref: 'p1' } });
		const renamed = network('9M');
		renamed.elements = renamed.elements.map((e) => ({ ...e, nodes: e.nodes.map((n) => ({ a: 'n1', b: 'n2' })[n as 'a' | 'b'] ?? n), ...(e.id === 'C1' ? { value: '1 n' } : {}) })) as typeof renamed.elements;
		await save(world.owner.id, sheet.id, { ...renamed, output: { node: 'n2' } });
		const { threads } = (await call(comments.GET, { user: world.owner, params: { id: sheet.id } })).body;
		expect([onC1, onNet, onPole].map((c) => statusOf(threads, c.body.comment.id))).toEqual(['current', 'current', 'current']);
	});
});

describe('threads: resolve, edit, delete', () => {
	it('anyone who may comment resolves and reopens; only the author edits; author or owner deletes', async () => {
		const world = await matrixWorld();
		const { sheet } = await world.sheet();
		const c = (await post(world.commenter, sheet.id, { body: 'first' })).body.comment;
		const patch = (user: typeof world.owner, body: unknown) => call(oneComment.PATCH, { user, params: { id: sheet.id, commentId: c.id }, method: 'PATCH', body });
		const del = (user: typeof world.owner) => call(oneComment.DELETE, { user, params: { id: sheet.id, commentId: c.id }, method: 'DELETE' });
		expect((await patch(world.editor, { resolved: true })).body.comment.resolvedBy).toBe(world.editor.id);
		expect((await patch(world.commenter, { resolved: false })).body.comment.resolvedAt).toBeNull();
		expect((await patch(world.viewer, { resolved: true })).status).toBe(403);
		expect((await patch(world.editor, { body: 'not mine' })).status).toBe(403);
		const edited = await patch(world.commenter, { body: 'first, *edited*' });
		expect(edited.body.comment).toMatchObject({ bodyHtml: '<p>first, <em>edited</em></p>' });
		expect(edited.body.comment.editedAt).not.toBeNull();
		expect((await del(world.editor)).status).toBe(403);
		expect((await del(world.owner)).status).toBe(204);
		expect((await del(world.owner)).status).toBe(404);
	});
});

describe('mentions', () => {
	it('an @handle notifies that person in the app and by e-mail; unknown handles stay plain text', async () => {
		const world = await matrixWorld();
		const { sheet } = await world.sheet('Probe tip 10:1');
		// People with real addresses (the matrix people are not meant to receive mail).
		const [lead, author, stranger] = [await person('Wren Halloway'), await person('Ilse Marwood'), await person('Tobin Quarry')];
		await addMember(world.workspace.id, lead.id, 'member');
		await setGrant(sheet.id, author.id, 'commenter', world.owner.id);
		const candidates = (await call(people.GET, { user: author, params: { id: sheet.id } })).body.people;
		const handle = candidates.find((p: { id: string }) => p.id === lead.id).handle;
		expect(handle).toBe(lead.email.split('@')[0]);
		// A guest (a grant, not a member) can be mentioned too; someone from elsewhere cannot.
		expect(candidates.map((p: { id: string }) => p.id)).toContain(author.id);
		expect(candidates.map((p: { id: string }) => p.id)).not.toContain(stranger.id);

		const text = `@${handle} can you check C1? Also @${stranger.email}.`;
		const made = await post(author, sheet.id, { body: text, anchor: { kind: 'element', ref: 'C1' } });
		expect(made.body.comment.mentions).toEqual([lead.id]);
		expect(made.body.comment.bodyHtml).toContain(`<span class="pw-mention" data-user-id="${lead.id}">@Wren Halloway</span>`);
		expect(made.body.comment.bodyHtml).toContain(`@${stranger.email}`);

		const [mail] = await inboxFor(lead.email);
		expect(mail.subject).toBe('Ilse Marwood mentioned you on “Probe tip 10:1”');
		expect(mail.text).toContain('can you check C1?');
		expect(mail.text).toContain(`/sheets/${sheet.id}#comment-${made.body.comment.id}`);
		expect(await inboxFor(stranger.email, { atLeast: 1, timeoutMs: 600 })).toEqual([]);

		const inApp = await call(notifications.GET, { user: lead });
		expect(inApp.body.unread).toBe(1);
		expect(inApp.body.notifications[0]).toMatchObject({ kind: 'mention', sheetName: 'Probe tip 10:1', actorName: 'Ilse Marwood' });
		expect((await call(notifications.GET, { user: author })).body.unread).toBe(0);
		const read = await call(readNotifications.POST, { user: lead, method: 'POST', body: {} });
		expect(read.body).toEqual({ marked: 1, unread: 0 });
	});

	it('a full address picks the person when two share the part before the @', async () => {
		const world = await matrixWorld();
		const { sheet } = await world.sheet();
		const local = `sam${Date.now()}`;
		const [a, b] = [await person('Sam A', `${local}@lab-a.test`), await person('Sam B', `${local}@lab-b.test`)];
		await setGrant(sheet.id, a.id, 'viewer', world.owner.id);
		await setGrant(sheet.id, b.id, 'viewer', world.owner.id);
		const handles = (await call(people.GET, { user: world.owner, params: { id: sheet.id } })).body.people.filter((p: { name: string }) => p.name.startsWith('Sam'));
		expect(handles.map((p: { handle: string }) => p.handle).sort()).toEqual([`${local}@lab-a.test`, `${local}@lab-b.test`]);
		const made = await post(world.owner, sheet.id, { body: `@${local}@lab-b.test and @${local}` });
		expect(made.body.comment.mentions).toEqual([b.id]);
		expect((await inboxFor(b.email))[0].subject).toContain('mentioned you');
	});
});
