// The `next` parameter of sign-in and sign-up: only a path on this site is followed, so a link
// cannot send someone from our sign-in page to another site (open redirect).
const BASE = 'http://polewise.invalid';

export function safeNext(next: string | null | undefined, fallback = '/workspaces'): string {
	if (!next || next.length > 1000 || !next.startsWith('/') || next.startsWith('//') || next.includes('\\')) return fallback;
	try {
		const url = new URL(next, BASE);
		if (url.origin !== BASE) return fallback;
		// Sending someone back to a sign-in page after signing in would be a loop.
		if (/^\/(sign-in|sign-up|sign-out)(\/|$)/.test(url.pathname)) return fallback;
		return url.pathname + url.search + url.hash;
	} catch {
		return fallback;
	}
}

/** `/sign-in?next=…` for the page someone tried to open. */
export function signInPath(url?: URL): string {
	if (!url) return '/sign-in';
	const here = url.pathname + url.search;
	return here === '/' ? '/sign-in' : `/sign-in?next=${encodeURIComponent(here)}`;
}
