// For read-only links, whose holders have no session for /api/analyze: the same solver runs in
// the browser (it is pure TypeScript), behind the same request/response shape the route uses —
// including `variants=all`, answered as { variants: [{ name, options, analysis, error }] }.
export const localAnalyzeFetch = (async (url: string, init: RequestInit) => {
	const { analyze, SolverError } = await import('$lib/solver');
	const { listVariants, resolveVariant } = await import('$lib/network/variants');
	// Doublets up to 50 % apart, as the editor asks the route (live-analysis.svelte.ts).
	const options = { frequency: { points: 240 }, step: { points: 400 }, doubletRatio: 0.5 };
	const failure = (e: unknown) =>
		e instanceof SolverError
			? e.toJSON()
			: {
					error: `the analysis failed: ${(e as Error).message}`,
					code: (e as { code?: string }).code
				};
	try {
		const body = JSON.parse(String(init.body));
		if (new URL(url, 'http://local').searchParams.get('variants') === 'all') {
			const variants = listVariants(body).map((v) => {
				try {
					return { ...v, analysis: analyze(resolveVariant(body, v), options), error: null };
				} catch (e) {
					return { ...v, analysis: null, error: failure(e) };
				}
			});
			return new Response(JSON.stringify({ variants }), { status: 200 });
		}
		return new Response(JSON.stringify(analyze(body, options)), { status: 200 });
	} catch (e) {
		return new Response(JSON.stringify(failure(e)), { status: 422 });
	}
}) as unknown as typeof fetch;
