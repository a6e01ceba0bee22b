// The review API's shapes as the browser sees them (JSON: dates are strings).
export type AnchorKind = 'sheet' | 'element' | 'net' | 'pole' | 'zero' | 'time_constant' | 'spec';
export type AnchorStatus = 'current' | 'changed' | 'removed';

export interface Anchor {
	kind: AnchorKind;
	ref?: string;
	snapshot?: { re?: number | null; im?: number | null; hz?: number | null; value?: number | null; label?: string; owners?: string[] };
}

export interface CommentView {
	id: string;
	parentId: string | null;
	authorId: string | null;
	authorName: string | null;
	revisionNumber: number;
	anchorKind: AnchorKind;
	anchorRef: string | null;
	anchorStatus: AnchorStatus;
	body: string;
	bodyHtml: string;
	resolvedAt: string | null;
	editedAt: string | null;
	deletedAt: string | null;
	createdAt: string;
	mine: boolean;
	replies: CommentView[];
}

export interface Person {
	id: string;
	name: string;
	email: string;
	handle: string;
}

export interface Reviewer {
	userId: string;
	name: string;
	email: string;
	decision: 'approve' | 'changes' | null;
	summary: string | null;
	answeredAt: string | null;
}

export interface ReviewRequest {
	id: string;
	revisionNumber: number;
	requesterName: string | null;
	message: string;
	dueOn: string | null;
	withdrawnAt: string | null;
	createdAt: string;
	reviewers: Reviewer[];
}

/** What the review badge needs: the sheet page's summary or a sheet-list row's state. */
export type ReviewSummaryLike = Pick<ReviewOverview['summary'], 'state' | 'label' | 'approvedRevision' | 'answered' | 'asked'> & {
	changedSinceApproval?: boolean;
};

export interface ReviewOverview {
	summary: {
		state: 'unreviewed' | 'waiting' | 'changes' | 'signed_off';
		label: string;
		requestId: string | null;
		revision: number | null;
		approvedRevision: number | null;
		answered: number;
		asked: number;
		changedSinceApproval: boolean;
		latestRevision: number;
	};
	requests: ReviewRequest[];
	mayRequest: boolean;
	myRequestId: string | null;
}

export interface ActivityItem {
	kind: string;
	sheetId: string | null;
	sheetName: string | null;
	actorName: string | null;
	detail: Record<string, unknown>;
	at: string;
}

/** How an anchor reads in a list: "C1", "net out", "pole p1", "τ of C2", "bandwidth", "whole sheet". */
export function anchorLabel(kind: AnchorKind, ref: string | null | undefined): string {
	switch (kind) {
		case 'sheet':
			return 'whole sheet';
		case 'element':
			return ref ?? '?';
		case 'net':
			return `net ${ref}`;
		case 'pole':
			return `pole ${ref}`;
		case 'zero':
			return `zero ${ref}`;
		case 'time_constant':
			return `τ of ${ref}`;
		default:
			return ref ?? 'spec';
	}
}
