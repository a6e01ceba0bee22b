// Password reset by e-mailed link: read from the real mail catcher, single use, 30-minute
// expiry (moved by editing the row, not by waiting), every session ended, no account disclosure.
import { describe, expect, it } from 'vitest';
import { useDatabase } from './support/database';
import { inboxFor, person, uniqueEmail } from './support/auth-helpers';
import { db } from '../../src/lib/server/db/connection';
import { requestPasswordReset, resetPassword, resetEmailFor } from '../../src/lib/server/auth/passwords';
import { createSession, validateSessionToken } from '../../src/lib/server/auth/session';
import { signIn } from '../../src/lib/server/auth/sign-in';

useDatabase();

const ORIGIN = 'http://polewise.example';
const linkIn = (text: string) => {
	const match = /http:\/\/polewise\.example\/reset-password\/([a-z2-7]+)/.exec(text);
	if (!match) throw new Error(`no reset link in:\n${text}`);
	return match[1];
};

async function mailedToken(email: string, atLeast = 1) {
	expect(await requestPasswordReset(email, '192.0.2.10', ORIGIN)).toEqual({ ok: true });
	const mail = await inboxFor(email, { atLeast });
	expect(mail.length).toBe(atLeast);
	return { token: linkIn(mail[0].text), mail: mail[0] };
}

describe('password reset', () => {
	it('mails a link that works once, ends every session, and the new password signs in', async () => {
		const ana = await person('reset-ana');
		const sessions = await Promise.all([createSession(ana.id), createSession(ana.id)]);
		const { token, mail } = await mailedToken(ana.email);
		expect(mail.subject).toBe('Reset your Polewise password');
		expect(mail.text).toContain('30 minutes');
		expect(mail.html).toContain(`/reset-password/${token}`);

		const [[row]] = (await db().query(`SELECT EXTRACT(EPOCH FROM (expires_at - now())) AS left FROM password_resets`)) as [{ left: string }[], unknown];
		expect(Number(row.left)).toBeGreaterThan(29 * 60);
		expect(Number(row.left)).toBeLessThanOrEqual(30 * 60);

		expect(await resetEmailFor(token)).toEqual({ state: 'valid', email: ana.email });
		expect((await resetPassword(token, 'brand new password 1', '192.0.2.10')).state).toBe('valid');
		for (const s of sessions) expect((await validateSessionToken(s.token)).user).toBeNull();
		expect((await signIn(ana.email, ana.password, '192.0.2.10')).ok).toBe(false);
		expect((await signIn(ana.email, 'brand new password 1', '192.0.2.10')).ok).toBe(true);

		// Second use of the same link: refused, and the password stays the first reset's.
		expect(await resetPassword(token, 'second new password 2', '192.0.2.10')).toEqual({ state: 'used' });
		expect((await resetEmailFor(token)).state).toBe('used');
		expect((await signIn(ana.email, 'second new password 2', '192.0.2.10')).ok).toBe(false);
	});

	it('refuses an expired link and leaves the password alone', async () => {
		const ana = await person('reset-late');
		const { token } = await mailedToken(ana.email);
		await db().query(`UPDATE password_resets SET expires_at = now() - interval '1 second'`);
		expect((await resetEmailFor(token)).state).toBe('expired');
		expect(await resetPassword(token, 'too late password', '192.0.2.10')).toEqual({ state: 'expired' });
		expect((await signIn(ana.email, ana.password, '192.0.2.10')).ok).toBe(true);
	});

	it('lets only one of two racing uses of a link through', async () => {
		const ana = await person('reset-race');
		const { token } = await mailedToken(ana.email);
		const results = await Promise.all([resetPassword(token, 'racing password one', '192.0.2.10'), resetPassword(token, 'racing password two', '192.0.2.10')]);
		expect(results.map((r) => r.state).sort()).toEqual(['used', 'valid']);
	});

	it('keeps only the newest link working', async () => {
		const ana = await person('reset-twice');
		const first = await mailedToken(ana.email, 1);
		const second = await mailedToken(ana.email, 2);
		expect(second.token).not.toBe(first.token);
		expect((await resetEmailFor(first.token)).state).toBe('unknown');
		expect((await resetEmailFor(second.token)).state).toBe('valid');
	});

	it('answers the same for an address with no account and sends nothing', async () => {
		const nobody = uniqueEmail('nobody');
		expect(await requestPasswordReset(nobody, '192.0.2.10', ORIGIN)).toEqual({ ok: true });
		expect(await inboxFor(nobody, { timeoutMs: 600 })).toEqual([]);
		expect((await resetEmailFor('not-a-real-token')).state).toBe('unknown');
	});
});
