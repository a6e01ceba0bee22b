// Sessions: opaque cookie token, SHA-256 of it as the row id, sliding 30-day expiry, and every
// session of an account ending when its password changes.
import { describe, expect, it } from 'vitest';
import { sha256 } from '@oslojs/crypto/sha2';
import { encodeHexLowerCase } from '@oslojs/encoding';
import { useDatabase } from './support/database';
import { inboxFor, person, uniqueEmail } from './support/auth-helpers';
import { db } from '../../src/lib/server/db/connection';
import { createSession, invalidateSession, invalidateUserSessions, SESSION_LIFETIME_MS, validateSessionToken } from '../../src/lib/server/auth/session';
import { changePassword } from '../../src/lib/server/auth/passwords';
import { confirmSignUp, signIn, signUp } from '../../src/lib/server/auth/sign-in';

useDatabase();

const DAY = 86_400_000;
const setExpiry = (id: string, at: Date) => db().query(`UPDATE sessions SET expires_at = :at WHERE id = :id`, { replacements: { at, id } });

describe('sessions', () => {
	it('stores only the SHA-256 of the cookie token and finds the user from the token', async () => {
		const ana = await person('ana');
		const { token, session } = await createSession(ana.id);
		expect(token).toMatch(/^[a-z2-7]{32}$/);
		expect(session.id).toBe(encodeHexLowerCase(sha256(new TextEncoder().encode(token))));
		const [rows] = await db().query(`SELECT id FROM sessions WHERE id = :token`, { replacements: { token } });
		expect(rows).toHaveLength(0);
		const found = await validateSessionToken(token);
		expect(found.user).toEqual({ id: ana.id, email: ana.email, name: ana.name });
		expect(Math.abs(found.session!.expiresAt.getTime() - Date.now() - SESSION_LIFETIME_MS)).toBeLessThan(5000);
		expect((await validateSessionToken(token + 'x')).user).toBeNull();
	});

	it('extends a session used with under 15 days left, and not one with more', async () => {
		const ana = await person('ana');
		const { token, session } = await createSession(ana.id);
		await setExpiry(session.id, new Date(Date.now() + 20 * DAY));
		expect((await validateSessionToken(token)).renewed).toBe(false);
		await setExpiry(session.id, new Date(Date.now() + 10 * DAY));
		const renewed = await validateSessionToken(token);
		expect(renewed.renewed).toBe(true);
		expect(renewed.session!.expiresAt.getTime()).toBeGreaterThan(Date.now() + 29 * DAY);
	});

	it('refuses and deletes an expired session', async () => {
		const ana = await person('ana');
		const { token, session } = await createSession(ana.id);
		await setExpiry(session.id, new Date(Date.now() - 1000));
		expect((await validateSessionToken(token)).session).toBeNull();
		const [rows] = await db().query(`SELECT 1 FROM sessions WHERE id = :id`, { replacements: { id: session.id } });
		expect(rows).toHaveLength(0);
	});

	it('gives a new session id at each sign-in and ends one session or all of them', async () => {
		const ana = await person('ana');
		const first = await signIn(ana.email, ana.password, '198.51.100.1');
		const second = await signIn(ana.email, ana.password, '198.51.100.1');
		if (!first.ok || !second.ok) throw new Error('sign-in failed');
		expect(first.session.id).not.toBe(second.session.id);
		await invalidateSession(first.session.id);
		expect((await validateSessionToken(first.token)).user).toBeNull();
		expect((await validateSessionToken(second.token)).user?.id).toBe(ana.id);
		await invalidateUserSessions(ana.id);
		expect((await validateSessionToken(second.token)).user).toBeNull();
	});

	it('ends every session of the account when the password changes, and the old password stops working', async () => {
		const ana = await person('ana');
		const other = await person('other');
		const otherSession = await createSession(other.id);
		const sessions = await Promise.all([createSession(ana.id), createSession(ana.id), createSession(ana.id)]);
		const refused = await changePassword(ana.id, 'not my password', 'a new long password', '198.51.100.1');
		expect(refused).toMatchObject({ ok: false, field: 'current' });
		expect((await validateSessionToken(sessions[0].token)).user?.id).toBe(ana.id);

		const changed = await changePassword(ana.id, ana.password, 'a new long password', '198.51.100.1');
		if (!changed.ok) throw new Error('change refused');
		for (const s of sessions) expect((await validateSessionToken(s.token)).user).toBeNull();
		expect((await validateSessionToken(changed.token)).user?.id).toBe(ana.id);
		expect((await validateSessionToken(otherSession.token)).user?.id).toBe(other.id);
		expect((await signIn(ana.email, ana.password, '198.51.100.1')).ok).toBe(false);
		expect((await signIn(ana.email, 'a new long password', '198.51.100.1')).ok).toBe(true);
	});

	it('hashes passwords with argon2id, m=19456 KiB, t=2, p=1 (OWASP Password Storage Cheat Sheet)', async () => {
		const email = uniqueEmail('new-person');
		await signUp({ email, name: 'New Person', password: 'a long enough password' }, '198.51.100.2', 'http://127.0.0.1:4173');
		const token = /\/sign-up\/([a-z2-7]{52})/.exec((await inboxFor(email))[0].text)![1];
		const outcome = await confirmSignUp(token, '198.51.100.2');
		if (!outcome.ok) throw new Error(outcome.state);
		const [[row]] = (await db().query(`SELECT password_hash FROM users WHERE id = :id`, { replacements: { id: outcome.user.id } })) as [{ password_hash: string }[], unknown];
		expect(row.password_hash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
		expect(row.password_hash).not.toContain('a long enough password');
		// Pending sign-ups keep only the hash too, and the used one is gone.
		expect((await db().query(`SELECT count(*)::int AS n FROM sign_up_requests`, { plain: true }))?.n).toBe(0);
	});

	it('makes no second account for the same address in another case', async () => {
		const ana = await person('ana');
		const outcome = await signUp({ email: ana.email.toUpperCase(), name: 'Copy', password: 'a long enough password' }, '198.51.100.3', 'http://127.0.0.1:4173');
		expect(outcome.ok).toBe(true);
		const [[{ n }]] = (await db().query(`SELECT count(*)::int AS n FROM users WHERE lower(email) = :e`, { replacements: { e: ana.email } })) as [{ n: number }[], unknown];
		expect(n).toBe(1);
		expect((await db().query(`SELECT count(*)::int AS n FROM sign_up_requests`, { plain: true }))?.n).toBe(0);
	});

	it('a link finished after the address got its account answers "taken", not a second account', async () => {
		const email = uniqueEmail('race');
		await signUp({ email, name: 'First', password: 'a long enough password' }, '198.51.100.4', 'http://127.0.0.1:4173');
		await signUp({ email, name: 'Second', password: 'another long password' }, '198.51.100.4', 'http://127.0.0.1:4173');
		const tokens = (await inboxFor(email, { atLeast: 2 })).map((m) => /\/sign-up\/([a-z2-7]{52})/.exec(m.text)![1]);
		expect((await confirmSignUp(tokens[0], '198.51.100.4')).ok).toBe(true);
		// Using one link removes the others for that address.
		expect(await confirmSignUp(tokens[1], '198.51.100.4')).toEqual({ ok: false, state: 'unknown' });
	});

});
