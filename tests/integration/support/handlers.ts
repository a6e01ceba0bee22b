// Call SvelteKit +server.ts handlers directly with a hand-made RequestEvent: the real routing
// code, access checks and PostgreSQL, without a server. `user: null` is a signed-out caller.
import type { RequestEvent, RequestHandler } from '@sveltejs/kit';

export interface CallOptions {
	user?: { id: string; email: string; name: string } | null;
	params?: Record<string, string>;
	method?: string;
	body?: unknown;
	/** Path and query after the origin, e.g. /api/sheets/…?permanent=1 */
	path?: string;
	rawBody?: string;
}

export interface CallResult {
	status: number;
	body: any; // eslint-disable-line @typescript-eslint/no-explicit-any
}

export async function call(handler: RequestHandler, options: CallOptions = {}): Promise<CallResult> {
	const url = new URL(options.path ?? '/api/test', 'http://127.0.0.1:5173');
	const method = options.method ?? 'GET';
	const payload = options.rawBody ?? (options.body === undefined ? undefined : JSON.stringify(options.body));
	const request = new Request(url, {
		method,
		body: method === 'GET' ? undefined : payload,
		headers: payload ? { 'content-type': 'application/json' } : {}
	});
	const user = options.user ?? null;
	const event = {
		request,
		url,
		params: options.params ?? {},
		locals: { user, session: null, auth: user ? 'session' : null },
		getClientAddress: () => '127.0.0.1',
		cookies: { get: () => undefined, getAll: () => [], set() {}, delete() {}, serialize: () => '' },
		fetch,
		platform: undefined,
		route: { id: null },
		setHeaders() {},
		isDataRequest: false,
		isSubRequest: false,
		isRemoteRequest: false,
		tracing: { enabled: false, root: null, current: null }
	} as unknown as RequestEvent;
	const response = await handler(event);
	const text = await response.text();
	return { status: response.status, body: text ? JSON.parse(text) : null };
}
