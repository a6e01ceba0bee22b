// Review requests and sign-off, and who may do what (through access.ts): commenters comment and
// answer the reviews they were asked for, viewers only read, guests see only their own sheet.
import { describe, expect, it } from 'vitest';
import { useDatabase } from './support/database';
import { call } from './support/handlers';
import { matrixWorld, network, person } from './support/fixtures';
import { inboxFor } from './support/auth-helpers';
import { getRevision, saveRevision } from '../../src/lib/server/db/sheets';
import { setGrant } from '../../src/lib/server/db/grants';
import { addMember } from '../../src/lib/server/db/workspaces';
import * as reviews from '../../src/routes/api/sheets/[id=uuid]/reviews/+server';
import * as answer from '../../src/routes/api/sheets/[id=uuid]/reviews/[requestId=uuid]/answer/+server';
import * as withdraw from '../../src/routes/api/sheets/[id=uuid]/reviews/[requestId=uuid]/+server';
import * as comments from '../../src/routes/api/sheets/[id=uuid]/comments/+server';
import * as activity from '../../src/routes/api/sheets/[id=uuid]/reviews/activity/+server';
import * as notifications from '../../src/routes/api/notifications/+server';

useDatabase();

type Who = { id: string; email: string; name: string };

async function save(userId: string, sheetId: string, document: unknown, layout: unknown = null) {
	const latest = (await getRevision(sheetId))!;
	return saveRevision(userId, sheetId, { document, layout }, latest.number);
}

/** The matrix, plus two people with real addresses: an author (editor) and a reviewer (commenter). */
async function reviewWorld() {
	const world = await matrixWorld();
	const { sheet } = await world.sheet('Attenuator 20 dB');
	const [author, reviewer] = [await person('Maren Oakes'), await person('Piet Calloway')];
	for (const p of [author, reviewer]) await addMember(world.workspace.id, p.id, 'member');
	await setGrant(sheet.id, author.id, 'editor', world.owner.id);
	await setGrant(sheet.id, reviewer.id, 'commenter', world.owner.id);
	return { ...world, another: world.sheet, sheet, author, reviewer };
}

const ask = (user: Who, sheetId: string, body: unknown) => call(reviews.POST, { user, params: { id: sheetId }, method: 'POST', body });
const reply = (user: Who, sheetId: string, requestId: string, body: unknown) => call(answer.POST, { user, params: { id: sheetId, requestId }, method: 'POST', body });
const overview = async (user: Who, sheetId: string) => (await call(reviews.GET, { user, params: { id: sheetId } })).body;

describe('review requests and sign-off', () => {
	it('asks, notifies by mail and in the app, and an approval pins the revision it was asked about', async () => {
		const w = await reviewWorld();
		expect((await overview(w.author, w.sheet.id)).summary).toMatchObject({ state: 'unreviewed', label: 'Not yet sent for review' });
		const made = await ask(w.author, w.sheet.id, { reviewers: [w.reviewer.email], message: 'Please check the shunt arm.', dueOn: '2026-12-18' });
		expect(made.status).toBe(201);
		expect(made.body.request).toMatchObject({ revisionNumber: 1, dueOn: '2026-12-18', reviewers: [{ userId: w.reviewer.id, decision: null }] });
		const [mail] = await inboxFor(w.reviewer.email);
		expect(mail.subject).toBe('Maren Oakes asks you to review “Attenuator 20 dB”');
		expect(mail.text).toContain('revision 1');
		expect(mail.text).toContain('by 2026-12-18');
		expect(mail.text).toContain('Please check the shunt arm.');
		expect((await call(notifications.GET, { user: w.reviewer })).body.notifications[0]).toMatchObject({ kind: 'review_requested' });

		let seen = await overview(w.reviewer, w.sheet.id);
		expect(seen.summary).toMatchObject({ state: 'waiting', label: 'With reviewers', revision: 1, asked: 1, answered: 0 });
		expect(seen.myRequestId).toBe(made.body.request.id);

		// The author saves revision 2 before the reviewer answers; the approval is still about revision 1.
		await save(w.author.id, w.sheet.id, network('8M'));
		const ok = await reply(w.reviewer, w.sheet.id, made.body.request.id, { decision: 'approve', summary: 'Arms match within 1 %.' });
		expect(ok.status).toBe(200);
		seen = await overview(w.author, w.sheet.id);
		expect(seen.summary).toMatchObject({ state: 'signed_off', label: 'Signed off', approvedRevision: 1, latestRevision: 2, changedSinceApproval: true });
		const [answerMail] = await inboxFor(w.author.email);
		expect(answerMail.subject).toBe('Piet Calloway signed off revision 1 of “Attenuator 20 dB”');
		expect(answerMail.text).toContain('Arms match within 1 %.');
	});

	it('a sign-off without a summary is refused and changes nothing; asking for changes may be brief', async () => {
		const w = await reviewWorld();
		const made = await ask(w.author, w.sheet.id, { reviewers: [w.reviewer.id], message: '' });
		const empty = await reply(w.reviewer, w.sheet.id, made.body.request.id, { decision: 'approve', summary: '   ' });
		expect(empty.status).toBe(400);
		expect(empty.body.error).toMatch(/summary: say in a line what you checked before signing off/);
		expect((await overview(w.author, w.sheet.id)).summary).toMatchObject({ state: 'waiting', answered: 0 });
		expect((await reply(w.reviewer, w.sheet.id, made.body.request.id, { decision: 'changes' })).status).toBe(200);
	});

	it('a layout-only save is not a change since approval; a value change is', async () => {
		const w = await reviewWorld();
		const made = await ask(w.author, w.sheet.id, { reviewers: [w.reviewer.id], message: '' });
		await reply(w.reviewer, w.sheet.id, made.body.request.id, { decision: 'approve', summary: 'Checked.' });
		await save(w.author.id, w.sheet.id, network('9M'), { items: [{ id: 'R1', x: 10, y: 20 }] });
		expect((await overview(w.author, w.sheet.id)).summary).toMatchObject({ approvedRevision: 1, latestRevision: 2, changedSinceApproval: false });
		await save(w.author.id, w.sheet.id, network('9.1M'));
		expect((await overview(w.author, w.sheet.id)).summary).toMatchObject({ approvedRevision: 1, changedSinceApproval: true });
	});

	it('changes asked outweighs an approval; a new request starts over; a withdrawn one no longer counts', async () => {
		const w = await reviewWorld();
		const first = await ask(w.author, w.sheet.id, { reviewers: [w.reviewer.email, w.commenter.id] });
		await reply(w.reviewer, w.sheet.id, first.body.request.id, { decision: 'approve', summary: 'Checked.' });
		expect((await overview(w.author, w.sheet.id)).summary.state).toBe('waiting');
		await reply(w.commenter, w.sheet.id, first.body.request.id, { decision: 'changes', summary: 'R2 runs hot' });
		expect((await overview(w.author, w.sheet.id)).summary).toMatchObject({ state: 'changes', label: 'Changes asked', approvedRevision: null });
		const second = await ask(w.author, w.sheet.id, { reviewers: [w.reviewer.id] });
		expect((await overview(w.author, w.sheet.id)).summary).toMatchObject({ state: 'waiting', requestId: second.body.request.id });
		expect((await call(withdraw.DELETE, { user: w.author, params: { id: w.sheet.id, requestId: second.body.request.id }, method: 'DELETE' })).status).toBe(204);
		expect((await overview(w.author, w.sheet.id)).summary).toMatchObject({ state: 'changes', requestId: first.body.request.id });
		const late = await reply(w.reviewer, w.sheet.id, second.body.request.id, { decision: 'approve', summary: 'Checked.' });
		expect(late.status).toBe(409);
	});

	it('refuses reviewers who cannot comment, strangers, yourself, and bad dates, naming the field', async () => {
		const w = await reviewWorld();
		const viewerOnly = await ask(w.author, w.sheet.id, { reviewers: [w.viewer.id] });
		expect(viewerOnly.status).toBe(400);
		expect(viewerOnly.body.error).toBe('reviewers: Viewer may only view this sheet; make them a commenter to ask for their review.');
		const stranger = await person('Outside Person');
		expect((await ask(w.author, w.sheet.id, { reviewers: [stranger.email] })).body.error).toContain('cannot open this sheet');
		expect((await ask(w.author, w.sheet.id, { reviewers: [w.author.email] })).body.error).toBe('reviewers: ask someone other than yourself.');
		expect((await ask(w.author, w.sheet.id, { reviewers: [w.reviewer.id], dueOn: '18/12/2026' })).body.error).toBe('dueOn: dueOn must be a date like 2026-12-24');
		expect((await ask(w.author, w.sheet.id, { reviewers: [] })).body.error).toBe('reviewers: reviewers: name at least one person');
	});
});

describe('who may do what', () => {
	it('commenters comment and answer what they were asked; viewers only read; others are turned away', async () => {
		const w = await reviewWorld();
		const made = await ask(w.author, w.sheet.id, { reviewers: [w.reviewer.id] });
		const requestId = made.body.request.id;
		const comment = (user: Who) => call(comments.POST, { user, params: { id: w.sheet.id }, method: 'POST', body: { body: 'hello' } });

		expect((await comment(w.reviewer)).status).toBe(201);
		expect((await comment(w.viewer)).status).toBe(403);
		expect((await call(comments.GET, { user: w.viewer, params: { id: w.sheet.id } })).status).toBe(200);
		expect((await call(reviews.GET, { user: w.viewer, params: { id: w.sheet.id } })).status).toBe(200);
		// A viewer cannot ask for reviews (needs save) nor answer (needs comment and a place on the request).
		expect((await ask(w.viewer, w.sheet.id, { reviewers: [w.reviewer.id] })).status).toBe(403);
		expect((await ask(w.reviewer, w.sheet.id, { reviewers: [w.author.id] })).status).toBe(403);
		expect((await reply(w.viewer, w.sheet.id, requestId, { decision: 'approve', summary: 'Checked.' })).status).toBe(403);
		// An editor who was not asked may not sign off in the reviewer's place.
		const notAsked = await reply(w.editor, w.sheet.id, requestId, { decision: 'approve', summary: 'Checked.' });
		expect(notAsked.status).toBe(403);
		expect(notAsked.body.error).toBe('You were not asked to review this request.');
		// Someone from another workspace: the sheet does not exist for them. Signed out: 401.
		expect((await call(comments.GET, { user: w.outsider, params: { id: w.sheet.id } })).status).toBe(404);
		expect((await call(comments.GET, { user: null, params: { id: w.sheet.id } })).status).toBe(401);
		// Grants made straight through the data layer leave no audit entry, so no "shared" rows here.
		const feed = (await call(activity.GET, { user: w.viewer, params: { id: w.sheet.id } })).body.activity;
		expect(feed.map((a: { kind: string }) => a.kind)).toEqual(['commented', 'review_requested', 'saved']);
	});

	it('a guest commenter sees and comments on their sheet only', async () => {
		const w = await reviewWorld();
		const { sheet: other } = await w.another('Private TIA');
		const guest = await person('Guest Reviewer');
		await setGrant(w.sheet.id, guest.id, 'commenter', w.owner.id);
		expect((await call(comments.POST, { user: guest, params: { id: w.sheet.id }, method: 'POST', body: { body: 'from outside' } })).status).toBe(201);
		expect((await call(comments.GET, { user: guest, params: { id: other.id } })).status).toBe(404);
		expect((await call(comments.POST, { user: guest, params: { id: other.id }, method: 'POST', body: { body: 'x' } })).status).toBe(404);
		expect((await call(reviews.GET, { user: guest, params: { id: other.id } })).status).toBe(404);
		// And a guest can be asked to review the sheet they were given.
		const made = await ask(w.author, w.sheet.id, { reviewers: [guest.id] });
		expect((await reply(guest, w.sheet.id, made.body.request.id, { decision: 'changes', summary: 'C3 too small' })).status).toBe(200);
	});
});
