// The sheet list's review filter, in the badge's words (review-badge.svelte).
import type { ListReviewFilter } from '$lib/schemas/sheet-list';

export const REVIEW_FILTER_CHOICES: { value: ListReviewFilter | ''; label: string }[] = [
	{ value: '', label: 'Any state' },
	{ value: 'unreviewed', label: 'Not yet sent for review' },
	{ value: 'waiting', label: 'With reviewers' },
	{ value: 'changes', label: 'Changes asked' },
	{ value: 'changed', label: 'Changed since sign-off' },
	{ value: 'signed_off', label: 'Signed off' }
];
