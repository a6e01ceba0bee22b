// Security headers on every answer the app itself makes — pages, form actions, API JSON,
// downloads, errors and the outage page. Pages get SvelteKit's Content-Security-Policy
// (kit.csp in svelte.config.js, with a nonce per page); any other answer without a policy of its
// own gets one that allows nothing, so a JSON or text answer opened in a browser can never run
// or load anything, nor be framed. Files under /_app/ are served by adapter-node before hooks
// run and do not get these (docs/security.md says what covers them).
import type { Handle } from '@sveltejs/kit';

export const SECURITY_HEADERS: Record<string, string> = {
	'x-content-type-options': 'nosniff',
	'referrer-policy': 'strict-origin-when-cross-origin',
	// Nothing in Polewise needs a camera, a microphone, a location or other device access.
	'permissions-policy':
		'camera=(), microphone=(), geolocation=(), payment=(), usb=(), serial=(), bluetooth=(), hid=(), midi=(), accelerometer=(), gyroscope=(), magnetometer=(), display-capture=()',
	// For browsers that predate CSP's frame-ancestors.
	'x-frame-options': 'DENY',
	'cross-origin-opener-policy': 'same-origin'
};

export const NOTHING_ALLOWED =
	"default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";

export function withSecurityHeaders(response: Response): Response {
	let r = response;
	try {
		r.headers.set('x-content-type-options', 'nosniff');
	} catch {
		// Some answers (a redirect made by Response.redirect) have immutable headers: copy.
		r = new Response(response.body, response);
	}
	for (const [name, value] of Object.entries(SECURITY_HEADERS)) r.headers.set(name, value);
	if (!r.headers.has('content-security-policy'))
		r.headers.set('content-security-policy', NOTHING_ALLOWED);
	return r;
}

export const securityHeadersHandle: Handle = async ({ event, resolve }) =>
	withSecurityHeaders(await resolve(event));
