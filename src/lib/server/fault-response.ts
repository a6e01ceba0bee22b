// The answers for a recognised fault (faults.ts): JSON for the API, SvelteKit's own format for
// form actions and client-side data requests (so the page's enhance and navigation read them),
// and a small page of its own for a browser. The page has no script and no outside resources.
import type { RequestEvent } from '@sveltejs/kit';
import type { Fault } from './faults';

const headersFor = (fault: Fault, type: string): Record<string, string> => ({
	'content-type': type,
	'cache-control': 'no-store',
	...(fault.retryAfterSeconds ? { 'retry-after': String(fault.retryAfterSeconds) } : {})
});

function unavailablePage(fault: Fault): string {
	const seconds = fault.retryAfterSeconds ?? 5;
	return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="refresh" content="${seconds}"><title>Briefly unavailable — Polewise</title>
<style>body{margin:0;font:16px/1.5 system-ui,sans-serif;background:#f7f5ef;color:#212529}main{max-width:34rem;margin:12vh auto;padding:0 1.5rem}h1{font-size:1.5rem;margin:0 0 .5rem}p{margin:0 0 1rem}@media (prefers-color-scheme:dark){body{background:#16181b;color:#e9e6df}}</style>
</head><body><main><p><strong>Polewise</strong></p><h1>Briefly unavailable</h1>
<p>${fault.message}</p><p>This page tries again by itself every ${seconds} seconds.</p></main></body></html>`;
}

/** `rendered` is SvelteKit's own 500 answer when it produced one (its body is kept where its
 * client needs the format). */
export function faultResponse(event: RequestEvent, fault: Fault, rendered?: Response): Response {
	const api = event.url.pathname.startsWith('/api/');
	const action = event.request.headers.get('x-sveltekit-action') === 'true';
	const data = event.isDataRequest || event.url.pathname.endsWith('/__data.json');
	if (api) {
		const body = {
			error: fault.message,
			code: fault.code,
			...(fault.retryAfterSeconds ? { retryAfterSeconds: fault.retryAfterSeconds } : {})
		};
		return new Response(JSON.stringify(body), {
			status: fault.status,
			headers: headersFor(fault, 'application/json')
		});
	}
	if (action || data) {
		if (rendered) {
			const headers = new Headers(rendered.headers);
			for (const [k, v] of Object.entries(
				headersFor(fault, headers.get('content-type') ?? 'application/json')
			))
				headers.set(k, v);
			return new Response(rendered.body, { status: fault.status, headers });
		}
		const body = { type: 'error', error: { message: fault.message, code: fault.code } };
		return new Response(JSON.stringify(body), {
			status: fault.status,
			headers: headersFor(fault, 'application/json')
		});
	}
	if (fault.code === 'unavailable') {
		return new Response(unavailablePage(fault), {
			status: fault.status,
			headers: {
				...headersFor(fault, 'text/html; charset=utf-8'),
				// Its own policy: SvelteKit's CSP covers only the pages it renders.
				'content-security-policy':
					"default-src 'none'; style-src 'unsafe-inline'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'"
			}
		});
	}
	// A bad value on a page: SvelteKit's error page, with the status it stands for.
	if (rendered)
		return new Response(rendered.body, { status: fault.status, headers: rendered.headers });
	return new Response(fault.message, {
		status: fault.status,
		headers: headersFor(fault, 'text/plain; charset=utf-8')
	});
}
