// What people do with comments, for the JSON API and the pages. Every verb asks the access
// module first: reading needs `read`, writing needs `comment` (commenters and up).
import { AccessDenied, authorizeSheet, type Actor } from '../access';
import { ApiProblem } from '../api/respond';
import { getRevision } from '../db/sheets';
import { getComment, insertComment, listAudience, listComments, editComment, markDeleted, setResolved, type CommentRecord } from '../db/comments';
import { recordActivity } from '../db/activity';
import type { NetworkDocument } from '../../network/schema';
import { mentionMail } from '../mail/review-templates';
import { publish, sheetChannel } from '../live/events';
import { anchorStatus, AnchorProblem, snapshotAnchor, type AnchorInput, type AnchorStatus } from './anchors';
import { handles, mentionResolver } from './mentions';
import { renderComment } from './markdown';
import { notify } from './notify';

type UserActor = Actor & { kind: 'user' };
export interface ReviewContext {
	origin: string;
	actorName: string;
}

export interface CommentView extends Omit<CommentRecord, 'anchorSnapshot' | 'body' | 'mentions'> {
	body: string;
	anchorSnapshot: unknown;
	anchorStatus: AnchorStatus;
	mine: boolean;
	replies: CommentView[];
}

const docOf = async (sheetId: string, n: number) => (await getRevision(sheetId, n))?.document as NetworkDocument | undefined;

/** Threads (oldest first), each comment marked by whether its anchor still looks as it did. */
export async function commentThreads(actor: Actor, sheetId: string) {
	const access = await authorizeSheet(actor, sheetId, 'read');
	const rows = await listComments(sheetId);
	const latestNumber = access.sheet.latestRevision;
	const docs = new Map<number, NetworkDocument | undefined>();
	for (const n of new Set([latestNumber, ...rows.map((r) => r.revisionNumber)])) docs.set(n, await docOf(sheetId, n));
	const latest = docs.get(latestNumber);
	const me = actor.kind === 'user' ? actor.id : null;
	const view = (c: CommentRecord): CommentView => {
		const written = docs.get(c.revisionNumber);
		const status = written && latest ? anchorStatus(c.anchorKind, c.anchorRef, c.anchorSnapshot, written, latest) : 'current';
		return { ...c, anchorStatus: status, mine: c.authorId !== null && c.authorId === me, replies: [] };
	};
	const roots = new Map<string, CommentView>();
	for (const c of rows) if (!c.parentId) roots.set(c.id, view(c));
	for (const c of rows) if (c.parentId) roots.get(c.parentId)?.replies.push(view(c));
	return { threads: [...roots.values()], latestRevision: latestNumber, canComment: access.can('comment'), access };
}

/** People the composer offers after `@`, with the handle it inserts. */
export async function mentionCandidates(actor: Actor, sheetId: string) {
	await authorizeSheet(actor, sheetId, 'read');
	const people = await listAudience(sheetId);
	const h = handles(people);
	return people.map((p) => ({ id: p.id, name: p.name, email: p.email, handle: h.get(p.id)! }));
}

async function rendered(sheetId: string, body: string) {
	const people = await listAudience(sheetId);
	return { people, ...renderComment(body, mentionResolver(people)) };
}

export async function addComment(
	actor: UserActor,
	sheetId: string,
	input: { body: string; anchor?: AnchorInput; revision?: number; parentId?: string },
	ctx: ReviewContext
): Promise<CommentRecord> {
	const { sheet } = await authorizeSheet(actor, sheetId, 'comment');
	const parent = input.parentId ? await getComment(sheetId, input.parentId) : null;
	if (input.parentId && (!parent || parent.deletedAt)) throw new ApiProblem(404, 'parentId: no such comment on this sheet.');
	const root = parent?.parentId ? await getComment(sheetId, parent.parentId) : parent;
	const number = input.revision ?? sheet.latestRevision;
	const revision = await getRevision(sheetId, number);
	if (!revision) throw new ApiProblem(400, `revision: the sheet has no revision ${number}.`);
	let anchor: { kind: CommentRecord['anchorKind']; ref: string | null; snapshot: unknown };
	if (root) anchor = { kind: root.anchorKind, ref: root.anchorRef, snapshot: root.anchorSnapshot };
	else {
		const a = input.anchor ?? { kind: 'sheet' as const };
		try {
			anchor = { kind: a.kind, ref: 'ref' in a ? a.ref : null, snapshot: snapshotAnchor(a, revision.document as NetworkDocument, number) };
		} catch (e) {
			if (e instanceof AnchorProblem) throw new ApiProblem(400, e.message);
			throw e;
		}
	}
	const { people, html, mentions } = await rendered(sheetId, input.body);
	const comment = await insertComment({
		sheetId,
		parentId: root?.id ?? null,
		authorId: actor.id,
		revisionNumber: number,
		anchorKind: anchor.kind,
		anchorRef: anchor.ref,
		anchorSnapshot: anchor.snapshot,
		body: input.body,
		bodyHtml: html,
		mentions
	});
	await recordActivity({ workspaceId: sheet.workspaceId, sheetId, actorId: actor.id, kind: 'commented', detail: { commentId: comment.id, anchor: anchor.ref ?? anchor.kind, revision: number } });
	await publish(sheetChannel(sheetId), 'comment', { action: 'added', commentId: comment.id, authorId: actor.id });
	const url = `${ctx.origin}/sheets/${sheetId}#comment-${comment.id}`;
	const byId = new Map(people.map((p) => [p.id, p]));
	await notify({
		recipients: mentions.map((id) => byId.get(id)!).filter(Boolean),
		kind: 'mention',
		actorId: actor.id,
		sheetId,
		detail: { commentId: comment.id, excerpt: input.body.slice(0, 200) },
		mail: () => mentionMail({ authorName: ctx.actorName, sheetName: sheet.name, text: input.body, url })
	});
	const threadAuthor = root?.authorId ? byId.get(root.authorId) : undefined;
	if (threadAuthor && !mentions.includes(threadAuthor.id)) {
		await notify({ recipients: [threadAuthor], kind: 'reply', actorId: actor.id, sheetId, detail: { commentId: comment.id, excerpt: input.body.slice(0, 200) } });
	}
	return comment;
}

async function ownComment(actor: UserActor, sheetId: string, commentId: string, action: 'edit' | 'delete') {
	const access = await authorizeSheet(actor, sheetId, 'comment');
	const comment = await getComment(sheetId, commentId);
	if (!comment || comment.deletedAt) throw new AccessDenied(404, 'No such comment on this sheet.');
	const moderator = access.role === 'owner' || access.role === 'admin';
	if (comment.authorId !== actor.id && !(action === 'delete' && moderator)) throw new AccessDenied(403, `Only its author may ${action} this comment.`);
	return { comment, access };
}

export async function changeComment(actor: UserActor, sheetId: string, commentId: string, body: string) {
	await ownComment(actor, sheetId, commentId, 'edit');
	const { html, mentions } = await rendered(sheetId, body);
	await editComment(commentId, { body, bodyHtml: html, mentions });
	await publish(sheetChannel(sheetId), 'comment', { action: 'edited', commentId });
	return (await getComment(sheetId, commentId))!;
}

export async function removeComment(actor: UserActor, sheetId: string, commentId: string) {
	await ownComment(actor, sheetId, commentId, 'delete');
	await markDeleted(commentId);
	await publish(sheetChannel(sheetId), 'comment', { action: 'deleted', commentId });
}

/** Resolve or reopen a thread (anyone who may comment; only a thread's first comment). */
export async function resolveThread(actor: UserActor, sheetId: string, commentId: string, resolved: boolean) {
	await authorizeSheet(actor, sheetId, 'comment');
	const comment = await getComment(sheetId, commentId);
	if (!comment || comment.deletedAt) throw new AccessDenied(404, 'No such comment on this sheet.');
	if (comment.parentId) throw new ApiProblem(400, 'Resolve the thread through its first comment.');
	await setResolved(commentId, resolved ? actor.id : null);
	await publish(sheetChannel(sheetId), 'comment', { action: resolved ? 'resolved' : 'reopened', commentId });
	return (await getComment(sheetId, commentId))!;
}
