// See https://svelte.dev/docs/kit/types#app.d.ts
declare global {
	namespace App {
		interface Error {
			message: string;
			/** A recognised fault ($lib/server/faults.ts): 'unavailable' or 'bad_value'. */
			code?: string;
		}
		interface Locals {
			/** The signed-in person (session cookie or API token), or null. */
			user: { id: string; email: string; name: string } | null;
			/** The browser session; null for API-token requests and signed-out visitors. */
			session: { id: string; expiresAt: Date } | null;
			/** How the request was authenticated. */
			auth: 'session' | 'token' | null;
			/** A recognised fault met while answering (set by handleError, read by faultHandle). */
			fault?: import('$lib/server/faults').Fault | null;
		}
		interface PageData {
			/** Extra skip links a page offers first in the tab order (the layout draws them). */
			skipLinks?: { href: string; label: string }[];
		}
		// interface PageState {}
		// interface Platform {}
	}
}

export {};
