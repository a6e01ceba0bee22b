// Review requests and their answers. A request names one revision and the people asked; each
// person answers once (they may change their answer while the request is open).
import { db } from './connection';
import { reviewModels } from './models/review';
import type { Decision } from './models/review-request';

export type { Decision };

export interface ReviewerRecord {
	userId: string;
	name: string;
	email: string;
	decision: Decision | null;
	summary: string | null;
	answeredAt: Date | null;
}

export interface ReviewRequestRecord {
	id: string;
	sheetId: string;
	revisionNumber: number;
	requestedBy: string | null;
	requesterName: string | null;
	message: string;
	dueOn: string | null;
	withdrawnAt: Date | null;
	createdAt: Date;
	reviewers: ReviewerRecord[];
}

export async function createReviewRequest(input: { sheetId: string; revisionNumber: number; requestedBy: string; message: string; dueOn: string | null; reviewerIds: string[] }): Promise<string> {
	const { ReviewRequest, ReviewAnswer } = reviewModels();
	return db().transaction(async (transaction) => {
		const request = await ReviewRequest.create(
			{ sheetId: input.sheetId, revisionNumber: input.revisionNumber, requestedBy: input.requestedBy, message: input.message, dueOn: input.dueOn, withdrawnAt: null },
			{ transaction }
		);
		await ReviewAnswer.bulkCreate(
			input.reviewerIds.map((reviewerId) => ({ requestId: request.id, reviewerId, decision: null, summary: null, answeredAt: null })),
			{ transaction }
		);
		return request.id;
	});
}

/** A sheet's requests, newest first, each with its reviewers and their answers. */
export async function listReviewRequests(sheetId: string): Promise<ReviewRequestRecord[]> {
	const [requests] = await db().query(
		`SELECT r.id, r.sheet_id AS "sheetId", r.revision_number AS "revisionNumber", r.requested_by AS "requestedBy", u.name AS "requesterName",
		        r.message, r.due_on AS "dueOn", r.withdrawn_at AS "withdrawnAt", r.created_at AS "createdAt"
		   FROM review_requests r LEFT JOIN users u ON u.id = r.requested_by WHERE r.sheet_id = :sheetId ORDER BY r.created_at DESC, r.id`,
		{ replacements: { sheetId } }
	);
	const [answers] = await db().query(
		`SELECT a.request_id AS "requestId", a.reviewer_id AS "userId", u.name, u.email, a.decision, a.summary, a.answered_at AS "answeredAt"
		   FROM review_answers a JOIN users u ON u.id = a.reviewer_id JOIN review_requests r ON r.id = a.request_id
		  WHERE r.sheet_id = :sheetId ORDER BY lower(u.name)`,
		{ replacements: { sheetId } }
	);
	const byRequest = new Map<string, ReviewerRecord[]>();
	for (const a of answers as (ReviewerRecord & { requestId: string })[]) {
		const { requestId, ...rest } = a;
		(byRequest.get(requestId) ?? byRequest.set(requestId, []).get(requestId)!).push(rest);
	}
	return (requests as Omit<ReviewRequestRecord, 'reviewers'>[]).map((r) => ({ ...r, reviewers: byRequest.get(r.id) ?? [] }));
}

/** Record one reviewer's answer; false when that person was not asked on this request. */
export async function answerReview(requestId: string, reviewerId: string, decision: Decision, summary: string): Promise<boolean> {
	const [count] = await reviewModels().ReviewAnswer.update({ decision, summary, answeredAt: new Date() }, { where: { requestId, reviewerId } });
	return count > 0;
}

export async function withdrawReview(requestId: string): Promise<void> {
	await reviewModels().ReviewRequest.update({ withdrawnAt: new Date() }, { where: { id: requestId, withdrawnAt: null } });
}

/** Open requests where this person still owes an answer, across every sheet. */
export async function pendingReviewsFor(userId: string) {
	const [rows] = await db().query(
		`SELECT r.id, r.sheet_id AS "sheetId", s.name AS "sheetName", r.revision_number AS "revisionNumber", r.due_on AS "dueOn"
		   FROM review_answers a JOIN review_requests r ON r.id = a.request_id JOIN sheets s ON s.id = r.sheet_id
		  WHERE a.reviewer_id = :userId AND a.decision IS NULL AND r.withdrawn_at IS NULL AND s.trashed_at IS NULL
		  ORDER BY r.due_on NULLS LAST, r.created_at`,
		{ replacements: { userId } }
	);
	return rows as { id: string; sheetId: string; sheetName: string; revisionNumber: number; dueOn: string | null }[];
}
