// The sheet table's sort keys, shared by the data layer, the pages and the API.
export const SHEET_SORTS = ['name', 'updated', 'status', 'author'] as const;
export type SheetSort = (typeof SHEET_SORTS)[number];
export const PER_PAGE = 25;

/** The sheet list's review-state filter: the sheet page's four states, plus a signed-off sheet
 * that changed since sign-off as its own (see server/review/state.ts). */
export const LIST_REVIEW_FILTERS = ['unreviewed', 'waiting', 'changes', 'changed', 'signed_off'] as const;
export type ListReviewFilter = (typeof LIST_REVIEW_FILTERS)[number];
