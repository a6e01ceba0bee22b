// Helpers for the identity tests: people with unique addresses, the fake mail inbox, and
// constructed SvelteKit request events for the hooks and form actions.
import type { Cookies, RequestEvent } from '@sveltejs/kit';
import { randomUUID } from 'node:crypto';
import { hashPassword } from '../../../src/lib/server/auth/password';
import { createUser } from '../../../src/lib/server/db/users';

export const uniqueEmail = (label: string) => `${label}-${randomUUID().slice(0, 8)}@example.test`;

export async function person(label: string, password = 'correct horse battery') {
	const email = uniqueEmail(label);
	const user = await createUser({ email, name: `Tester ${label}`, passwordHash: await hashPassword(password) });
	return { ...user, password };
}

interface CaughtMail {
	to: string[];
	subject: string;
	text: string;
	html: string | null;
}

/** Mail the catcher holds for an address, polled briefly (sending is not awaited by the app). */
export async function inboxFor(address: string, { atLeast = 1, timeoutMs = 5000 } = {}): Promise<CaughtMail[]> {
	const base = process.env.MAIL_INBOX_URL;
	if (!base) throw new Error('MAIL_INBOX_URL is not set: run through `npm test`');
	const deadline = Date.now() + timeoutMs;
	for (;;) {
		const messages = (await (await fetch(`${base}/api/messages?to=${encodeURIComponent(address)}`)).json()) as CaughtMail[];
		if (messages.length >= atLeast || Date.now() > deadline) return messages;
		await new Promise((r) => setTimeout(r, 100));
	}
}

export class CookieJar {
	values = new Map<string, string>();
	options = new Map<string, Record<string, unknown>>();
	get = (name: string) => this.values.get(name);
	getAll = () => [...this.values].map(([name, value]) => ({ name, value }));
	set = (name: string, value: string, opts: Record<string, unknown>) => {
		this.values.set(name, value);
		this.options.set(name, opts);
	};
	delete = (name: string, opts: Record<string, unknown>) => {
		this.values.delete(name);
		this.options.set(name, { ...opts, deleted: true });
	};
	serialize = () => '';
}

/** A request event with just what our hooks and actions read. */
export function requestEvent(input: { url?: string; method?: string; headers?: Record<string, string>; body?: FormData; cookies?: CookieJar; ip?: string }) {
	const url = new URL(input.url ?? 'http://127.0.0.1:4173/');
	const cookies = input.cookies ?? new CookieJar();
	const request = new Request(url, { method: input.method ?? (input.body ? 'POST' : 'GET'), headers: input.headers, body: input.body });
	const event = {
		url,
		request,
		cookies: cookies as unknown as Cookies,
		locals: { user: null, session: null, auth: null } as App.Locals,
		params: {},
		getClientAddress: () => input.ip ?? '203.0.113.7',
		setHeaders: () => undefined
	};
	return { event: event as unknown as RequestEvent & { params: Record<string, string> }, cookies };
}
