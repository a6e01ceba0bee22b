// A sheet's review state, in Polewise's own words, from its newest request that was not
// withdrawn: nobody asked yet, reviewers still looking, changes asked, or signed off (with the
// revision that was signed off, and whether the network changed after it).
import type { ReviewRequestRecord } from '../db/reviews';
import { LIST_REVIEW_FILTERS, type ListReviewFilter } from '../../schemas/sheet-list';

export { LIST_REVIEW_FILTERS, type ListReviewFilter };

export const REVIEW_STATES = {
	unreviewed: 'Not yet sent for review',
	waiting: 'With reviewers',
	changes: 'Changes asked',
	signed_off: 'Signed off'
} as const;
export type ReviewState = keyof typeof REVIEW_STATES;

export interface ReviewSummary {
	state: ReviewState;
	label: string;
	/** The request the state comes from. */
	requestId: string | null;
	/** The revision the reviewers were asked about (pinned by an approval). */
	revision: number | null;
	approvedRevision: number | null;
	answered: number;
	asked: number;
}

/** A sheet's state in the sheet list: the summary's figures and whether it changed since sign-off. */
export interface ListReviewState {
	state: ReviewState;
	label: string;
	approvedRevision: number | null;
	answered: number;
	asked: number;
	changedSinceApproval: boolean;
}

/** The list's filter: the four states, with a signed-off sheet that changed since as its own. */
export const filterOf = (s: ListReviewState): ListReviewFilter => (s.state === 'signed_off' && s.changedSinceApproval ? 'changed' : s.state);
/** Sorting by state, ascending: from "not yet sent" to "signed off", what needs a look in between. */
export const stateRank = (s: ListReviewState) => LIST_REVIEW_FILTERS.indexOf(filterOf(s));

/** The state from the current request's decisions (null: no request that stands). */
export function stateOf(decisions: ('approve' | 'changes' | null)[] | null, revision: number | null): ListReviewState {
	if (!decisions) return { state: 'unreviewed', label: REVIEW_STATES.unreviewed, approvedRevision: null, answered: 0, asked: 0, changedSinceApproval: false };
	const state: ReviewState = decisions.includes('changes')
		? 'changes'
		: decisions.length > 0 && decisions.every((d) => d === 'approve')
			? 'signed_off'
			: 'waiting';
	return {
		state,
		label: REVIEW_STATES[state],
		approvedRevision: state === 'signed_off' ? revision : null,
		answered: decisions.filter((d) => d !== null).length,
		asked: decisions.length,
		changedSinceApproval: false
	};
}

export function summarize(requests: ReviewRequestRecord[]): ReviewSummary {
	const current = requests.find((r) => !r.withdrawnAt);
	const s = stateOf(current ? current.reviewers.map((r) => r.decision) : null, current?.revisionNumber ?? null);
	return {
		state: s.state,
		label: s.label,
		requestId: current?.id ?? null,
		revision: current?.revisionNumber ?? null,
		approvedRevision: s.approvedRevision,
		answered: s.answered,
		asked: s.asked
	};
}
