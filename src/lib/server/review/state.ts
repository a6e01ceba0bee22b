// A sheet's review state, in Polewise's own words, from its newest request that was not
// withdrawn: nobody asked yet, reviewers still looking, changes asked, or signed off (with the
// revision that was signed off, and whether the network changed after it).
import type { ReviewRequestRecord } from '../db/reviews';

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

export function summarize(requests: ReviewRequestRecord[]): ReviewSummary {
	const current = requests.find((r) => !r.withdrawnAt);
	if (!current) return { state: 'unreviewed', label: REVIEW_STATES.unreviewed, requestId: null, revision: null, approvedRevision: null, answered: 0, asked: 0 };
	const decisions = current.reviewers.map((r) => r.decision);
	const answered = decisions.filter((d) => d !== null).length;
	const state: ReviewState = decisions.includes('changes')
		? 'changes'
		: decisions.length > 0 && decisions.every((d) => d === 'approve')
			? 'signed_off'
			: 'waiting';
	return {
		state,
		label: REVIEW_STATES[state],
		requestId: current.id,
		revision: current.revisionNumber,
		approvedRevision: state === 'signed_off' ? current.revisionNumber : null,
		answered,
		asked: decisions.length
	};
}
