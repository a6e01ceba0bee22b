// The form actions as SvelteKit calls them: field errors beside fields, values kept (never the
// password), one message for any wrong part, safe `next` redirects, and the new session cookie.
import { describe, expect, it } from 'vitest';
import { isRedirect } from '@sveltejs/kit';
import { useDatabase } from './support/database';
import { inboxFor, person, requestEvent, uniqueEmail } from './support/auth-helpers';
import { actions as confirmActions } from '../../src/routes/(auth)/sign-up/[token=token]/+page.server';
import { findUserByEmail } from '../../src/lib/server/db/users';
import { actions as signInActions } from '../../src/routes/(auth)/sign-in/+page.server';
import { actions as signUpActions } from '../../src/routes/(auth)/sign-up/+page.server';
import { SESSION_COOKIE, validateSessionToken } from '../../src/lib/server/auth/session';
import { SIGN_IN_FAILED, SIGN_UP_SENT } from '../../src/lib/server/auth/sign-in';
import { safeNext } from '../../src/lib/server/auth/next';

useDatabase();

const formOf = (fields: Record<string, string>) => {
	const body = new FormData();
	for (const [k, v] of Object.entries(fields)) body.set(k, v);
	return body;
};

const run = (action: (e: never) => unknown, url: string, fields: Record<string, string>) => runWith(action, url, {}, fields);

async function runWith(action: (e: never) => unknown, url: string, params: Record<string, string>, fields: Record<string, string> = {}) {
	const { event, cookies } = requestEvent({ url, body: formOf(fields) });
	event.params = params;
	try {
		return { result: (await action(event as never)) as { status: number; data: Record<string, unknown> }, cookies, location: null };
	} catch (e) {
		if (isRedirect(e)) return { result: null, cookies, location: e.location };
		throw e;
	}
}

describe('sign-in and sign-up form actions', () => {
	it('signs in, sets an httpOnly SameSite=Lax cookie holding a live session, and follows a same-site next', async () => {
		const ana = await person('form-ana');
		const { location, cookies } = await run(signInActions.default, 'http://127.0.0.1:4173/sign-in?next=/invitations/abc', { email: ana.email.toUpperCase(), password: ana.password });
		expect(location).toBe('/invitations/abc');
		const token = cookies.values.get(SESSION_COOKIE)!;
		expect((await validateSessionToken(token)).user?.id).toBe(ana.id);
		expect(cookies.options.get(SESSION_COOKIE)).toMatchObject({ httpOnly: true, sameSite: 'lax', path: '/', secure: false });
	});

	it('says the same thing for a wrong password and an unknown address, keeping the address only', async () => {
		const ana = await person('form-wrong');
		const wrong = await run(signInActions.default, 'http://127.0.0.1:4173/sign-in', { email: ana.email, password: 'not the password' });
		const unknown = await run(signInActions.default, 'http://127.0.0.1:4173/sign-in', { email: 'nobody-here@example.test', password: 'not the password' });
		for (const { result } of [wrong, unknown]) {
			expect(result?.status).toBe(400);
			expect(result?.data.message).toBe(SIGN_IN_FAILED);
			expect(JSON.stringify(result?.data)).not.toContain('not the password');
		}
	});

	it('puts field errors beside each field and keeps name and address, not the password', async () => {
		const { result } = await run(signUpActions.default, 'http://127.0.0.1:4173/sign-up', { name: '<b>Ana</b>', email: 'not-an-address', password: 'short' });
		expect(result?.status).toBe(400);
		expect(result?.data.errors).toEqual({
			name: 'A name cannot contain < or >.',
			email: 'Enter an e-mail address like name@example.com.',
			password: 'Use at least 10 characters.'
		});
		expect(result?.data.values).toEqual({ name: '<b>Ana</b>', email: 'not-an-address' });

		const long = await run(signUpActions.default, 'http://127.0.0.1:4173/sign-up', { name: 'x'.repeat(101), email: `${'a'.repeat(250)}@example.test`, password: 'same@example.test' });
		expect(long.result?.data.errors).toMatchObject({ name: 'A name has at most 100 characters.', email: 'An e-mail address has at most 254 characters.' });
		const same = await run(signUpActions.default, 'http://127.0.0.1:4173/sign-up', { name: 'Ana', email: 'same-as-pw@example.test', password: 'Same-As-Pw@example.test' });
		expect(same.result?.data.errors).toEqual({ password: 'Choose a password that is not your e-mail address.' });
	});

	it('mails a link; the link makes the account, signs it in and goes to /workspaces when next is not a path here', async () => {
		const email = uniqueEmail('ana.lind');
		const { result } = await run(signUpActions.default, 'http://127.0.0.1:4173/sign-up?next=//evil.example/x', { name: 'Ana Lind', email, password: 'a long enough password' });
		expect(result).toMatchObject({ sent: true, message: SIGN_UP_SENT(email) });
		expect(await findUserByEmail(email)).toBeNull();
		const [mail] = await inboxFor(email);
		expect(mail.subject).toBe('Finish creating your Polewise account');
		const token = /\/sign-up\/([a-z2-7]{52})/.exec(mail.text)![1];
		const confirm = await runWith(confirmActions.default, `http://127.0.0.1:4173/sign-up/${token}`, { token });
		expect(confirm.location).toBe('/workspaces');
		expect((await validateSessionToken(confirm.cookies.values.get(SESSION_COOKIE)!)).user?.name).toBe('Ana Lind');
		// The link works once.
		const again = await runWith(confirmActions.default, `http://127.0.0.1:4173/sign-up/${token}`, { token });
		expect(again.result).toMatchObject({ status: 410, data: { state: 'unknown' } });
	});

	// Issue 14: sign-up said "An account with this e-mail address already exists", telling anyone
	// who has an account. Now both answers are the same, and the owner hears about the attempt.
	it('answers an address with an account exactly like a new one, and mails its owner instead', async () => {
		const owner = await person('sign-up-owner');
		const fresh = uniqueEmail('sign-up-fresh');
		const taken = await run(signUpActions.default, 'http://127.0.0.1:4173/sign-up', { name: 'Someone', email: owner.email, password: 'a long enough password' });
		const unused = await run(signUpActions.default, 'http://127.0.0.1:4173/sign-up', { name: 'Someone', email: fresh, password: 'a long enough password' });
		const shape = (r: typeof taken) => JSON.stringify(r.result).replaceAll(owner.email, 'ADDRESS').replaceAll(fresh, 'ADDRESS');
		expect(shape(taken)).toBe(shape(unused));
		expect(taken.location).toBeNull();
		expect(taken.cookies.values.size).toBe(0);
		const [note] = await inboxFor(owner.email);
		expect(note.subject).toBe('Someone tried to create a Polewise account with your address');
		expect(note.text).toContain('nothing was created');
		expect(note.text).not.toMatch(/\/sign-up\/[a-z2-7]{52}/);
		expect((await inboxFor(fresh))[0].subject).toBe('Finish creating your Polewise account');
	});

	it('follows only same-site paths in next', () => {
		expect(safeNext('/invitations/abc?x=1')).toBe('/invitations/abc?x=1');
		for (const bad of ['//evil.example', 'https://evil.example/', '/\\evil.example', 'javascript:alert(1)', '/sign-in', '', null]) expect(safeNext(bad)).toBe('/workspaces');
	});
});
