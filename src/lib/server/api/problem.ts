// A request the caller can fix, with the HTTP status it stands for. Its own module (no SvelteKit
// or database imports) so the command line can share the request parsing that throws it.
export class ApiProblem extends Error {
	constructor(
		readonly status: number,
		message: string,
		readonly details: Record<string, unknown> = {}
	) {
		super(message);
	}
}
