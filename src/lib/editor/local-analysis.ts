// For read-only links, whose holders have no session for /api/analyze: the same solver runs in
// the browser (it is pure TypeScript), behind the same request/response shape the route uses.
export const localAnalyzeFetch = (async (_url: string, init: RequestInit) => {
	const { analyze, SolverError } = await import('$lib/solver');
	try {
		const body = JSON.parse(String(init.body));
		return new Response(
			JSON.stringify(analyze(body, { frequency: { points: 240 }, step: { points: 400 } })),
			{ status: 200 }
		);
	} catch (e) {
		const payload =
			e instanceof SolverError
				? e.toJSON()
				: { error: `the analysis failed: ${(e as Error).message}` };
		return new Response(JSON.stringify(payload), { status: 422 });
	}
}) as unknown as typeof fetch;
