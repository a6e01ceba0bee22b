// The sheet table's sort keys, shared by the data layer, the pages and the API.
export const SHEET_SORTS = ['name', 'updated', 'status', 'author'] as const;
export type SheetSort = (typeof SHEET_SORTS)[number];
export const PER_PAGE = 25;
