// Review requests and sign-off. Asking needs `save` on the sheet (its authors and editors);
// answering needs `comment` and a place on the request, so a commenter can sign off what they
// were asked to look at and nothing else.
import { AccessDenied, authorizeSheet, can, type Actor } from '../access';
import { ApiProblem } from '../api/respond';
import { getRevision } from '../db/sheets';
import { listAudience } from '../db/comments';
import { answerReview, createReviewRequest, listReviewRequests, withdrawReview, type Decision } from '../db/reviews';
import { recordActivity } from '../db/activity';
import { getGrant } from '../db/grants';
import { getMembership } from '../db/workspaces';
import { reviewAnswerMail, reviewRequestMail } from '../mail/review-templates';
import { publish, sheetChannel } from '../live/events';
import type { NetworkDocument } from '../../network/schema';
import { sameNetwork } from './wiring';
import { notify } from './notify';
import { summarize } from './state';
import type { ReviewContext } from './comment-actions';

type UserActor = Actor & { kind: 'user' };

/** The review state, the requests, and whether the network changed after the signed-off revision. */
export async function reviewOverview(actor: Actor, sheetId: string) {
	const access = await authorizeSheet(actor, sheetId, 'read');
	const requests = await listReviewRequests(sheetId);
	const summary = summarize(requests);
	let changedSinceApproval = false;
	if (summary.approvedRevision !== null && summary.approvedRevision < access.sheet.latestRevision) {
		const [approved, latest] = await Promise.all([getRevision(sheetId, summary.approvedRevision), getRevision(sheetId)]);
		changedSinceApproval = !!approved && !!latest && !sameNetwork(approved.document as NetworkDocument, latest.document as NetworkDocument);
	}
	const me = actor.kind === 'user' ? actor.id : null;
	const myTurn = requests.find((r) => !r.withdrawnAt && r.reviewers.some((x) => x.userId === me));
	return {
		summary: { ...summary, changedSinceApproval, latestRevision: access.sheet.latestRevision },
		requests,
		mayRequest: access.can('save'),
		/** The open request this caller was asked on (they may answer it), if any. */
		myRequestId: myTurn && access.can('comment') ? myTurn.id : null
	};
}

/** Can this person comment on the sheet (so can they review it)? */
async function mayReview(userId: string, sheetId: string, workspace: { id: string; defaultSheetRole: 'editor' | 'commenter' | 'viewer' }, trashed: boolean) {
	const [m, g] = await Promise.all([getMembership(workspace.id, userId), getGrant(sheetId, userId)]);
	return can({ kind: 'user', id: userId }, 'comment', {
		kind: 'sheet',
		sheetId,
		workspaceRole: m?.role ?? null,
		defaultSheetRole: workspace.defaultSheetRole,
		grantRole: g?.role ?? null,
		trashed
	});
}

export async function requestReview(
	actor: UserActor,
	sheetId: string,
	input: { reviewers: string[]; message: string; dueOn?: string | null; revision?: number },
	ctx: ReviewContext
) {
	const { sheet, workspace } = await authorizeSheet(actor, sheetId, 'save');
	const number = input.revision ?? sheet.latestRevision;
	if (!(await getRevision(sheetId, number))) throw new ApiProblem(400, `revision: the sheet has no revision ${number}.`);
	const audience = await listAudience(sheetId);
	const reviewers = [];
	for (const who of new Set(input.reviewers.map((r) => r.trim().toLowerCase()))) {
		const person = audience.find((p) => p.id === who || p.email.toLowerCase() === who);
		if (!person) throw new ApiProblem(400, `reviewers: ${who} cannot open this sheet; share it with them first.`);
		if (person.id === actor.id) throw new ApiProblem(400, 'reviewers: ask someone other than yourself.');
		if (!(await mayReview(person.id, sheetId, workspace, sheet.trashedAt !== null))) {
			throw new ApiProblem(400, `reviewers: ${person.name} may only view this sheet; make them a commenter to ask for their review.`);
		}
		reviewers.push(person);
	}
	const requestId = await createReviewRequest({ sheetId, revisionNumber: number, requestedBy: actor.id, message: input.message, dueOn: input.dueOn ?? null, reviewerIds: reviewers.map((r) => r.id) });
	await recordActivity({ workspaceId: sheet.workspaceId, sheetId, actorId: actor.id, kind: 'review_requested', detail: { revision: number, reviewers: reviewers.map((r) => r.name) } });
	await publish(sheetChannel(sheetId), 'review', { action: 'requested', requestId });
	const url = `${ctx.origin}/sheets/${sheetId}#review`;
	await notify({
		recipients: reviewers,
		kind: 'review_requested',
		actorId: actor.id,
		sheetId,
		detail: { requestId, revision: number, dueOn: input.dueOn ?? null },
		mail: () => reviewRequestMail({ requesterName: ctx.actorName, sheetName: sheet.name, revision: number, message: input.message, dueOn: input.dueOn ?? null, url })
	});
	return (await listReviewRequests(sheetId)).find((r) => r.id === requestId)!;
}

export async function answerRequest(actor: UserActor, sheetId: string, requestId: string, input: { decision: Decision; summary: string }, ctx: ReviewContext) {
	const { sheet } = await authorizeSheet(actor, sheetId, 'comment');
	const request = (await listReviewRequests(sheetId)).find((r) => r.id === requestId);
	if (!request) throw new AccessDenied(404, 'No such review request on this sheet.');
	if (request.withdrawnAt) throw new ApiProblem(409, 'This review request was withdrawn.');
	if (!(await answerReview(requestId, actor.id, input.decision, input.summary))) throw new AccessDenied(403, 'You were not asked to review this request.');
	await recordActivity({ workspaceId: sheet.workspaceId, sheetId, actorId: actor.id, kind: 'review_answered', detail: { revision: request.revisionNumber, decision: input.decision } });
	await publish(sheetChannel(sheetId), 'review', { action: 'answered', requestId, decision: input.decision });
	const audience = await listAudience(sheetId);
	const requester = audience.find((p) => p.id === request.requestedBy);
	await notify({
		recipients: requester ? [requester] : [],
		kind: 'review_answered',
		actorId: actor.id,
		sheetId,
		detail: { requestId, revision: request.revisionNumber, decision: input.decision },
		mail: () => reviewAnswerMail({ reviewerName: ctx.actorName, sheetName: sheet.name, revision: request.revisionNumber, decision: input.decision, summary: input.summary, url: `${ctx.origin}/sheets/${sheetId}#review` })
	});
	return (await listReviewRequests(sheetId)).find((r) => r.id === requestId)!;
}

export async function withdrawRequest(actor: UserActor, sheetId: string, requestId: string) {
	await authorizeSheet(actor, sheetId, 'save');
	const request = (await listReviewRequests(sheetId)).find((r) => r.id === requestId);
	if (!request) throw new AccessDenied(404, 'No such review request on this sheet.');
	await withdrawReview(requestId);
	await publish(sheetChannel(sheetId), 'review', { action: 'withdrawn', requestId });
}
