// The sheet tables keep sort, filter and page in the URL; this builds the link for a change,
// leaving out defaults so URLs stay short.
export function listHref(current: Record<string, string | number | undefined>, changes: Record<string, string | number | undefined>): string {
	const params = new URLSearchParams();
	for (const [k, v] of Object.entries({ ...current, ...changes })) {
		if (v !== undefined && v !== '' && !(k === 'page' && v === 1)) params.set(k, String(v));
	}
	const query = params.toString();
	return query ? `?${query}` : '?';
}
