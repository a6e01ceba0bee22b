/** Case-insensitive search over some text fields, then one page of the matches. */
export function pageOf<T>(
	rows: T[],
	text: (row: T) => string,
	query: string,
	page: number,
	size: number
): { rows: T[]; matches: number; pages: number; page: number } {
	const q = query.trim().toLowerCase();
	const hits = q ? rows.filter((r) => text(r).toLowerCase().includes(q)) : rows;
	const pages = Math.max(1, Math.ceil(hits.length / size));
	const p = Math.min(Math.max(0, page), pages - 1);
	return { rows: hits.slice(p * size, (p + 1) * size), matches: hits.length, pages, page: p };
}
