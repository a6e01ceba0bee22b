// Rate limits in PostgreSQL: failed sign-ins per account and per client address, reset
// requests, and the counter's atomicity under concurrent hits.
import { describe, expect, it } from 'vitest';
import { useDatabase } from './support/database';
import { person, uniqueEmail } from './support/auth-helpers';
import { db } from '../../src/lib/server/db/connection';
import { signIn } from '../../src/lib/server/auth/sign-in';
import { requestPasswordReset } from '../../src/lib/server/auth/passwords';
import { checkLimit, hitLimit, RULES, waitMessage } from '../../src/lib/server/rate-limit';

useDatabase();

describe('rate limits', () => {
	it('blocks an account after 5 failed sign-ins, even with the right password, until the window closes', async () => {
		const ana = await person('limit-ana');
		for (let i = 0; i < 5; i++) {
			expect(await signIn(ana.email, `wrong password ${i}`, `198.18.0.${i}`)).toMatchObject({ ok: false, reason: 'invalid' });
		}
		const blocked = await signIn(ana.email, ana.password, '198.18.0.99');
		expect(blocked).toMatchObject({ ok: false, reason: 'limited', message: 'Too many failed sign-ins. Try again in 15 minutes.' });
		// Close the window by moving its end into the past (no sleeping).
		await db().query(`UPDATE rate_limits SET expires_at = now() - interval '1 second'`);
		expect((await signIn(ana.email, ana.password, '198.18.0.99')).ok).toBe(true);
	});

	it('blocks a client address after 20 failures spread over many accounts', async () => {
		for (let i = 0; i < 20; i++) await signIn(uniqueEmail('spray'), 'a guessed password', '198.18.1.1');
		const fresh = await person('limit-fresh');
		expect(await signIn(fresh.email, fresh.password, '198.18.1.1')).toMatchObject({ ok: false, reason: 'limited' });
		expect((await signIn(fresh.email, fresh.password, '198.18.1.2')).ok).toBe(true);
	});

	it('clears the account counter on a successful sign-in', async () => {
		const ana = await person('limit-clear');
		for (let i = 0; i < 4; i++) await signIn(ana.email, 'wrong password', '198.18.2.1');
		expect((await signIn(ana.email, ana.password, '198.18.2.1')).ok).toBe(true);
		expect((await checkLimit(RULES.signInAccount, ana.email)).points).toBe(0);
	});

	it('limits reset requests to 3 an hour per typed address, known or not, with the same message', async () => {
		const ana = await person('limit-reset');
		for (const email of [ana.email, uniqueEmail('no-account')]) {
			for (let i = 0; i < 3; i++) expect(await requestPasswordReset(email, `198.18.3.${i}`, 'http://x.test')).toEqual({ ok: true });
			expect(await requestPasswordReset(email, '198.18.3.9', 'http://x.test')).toEqual({ ok: false, message: 'Too many reset requests. Try again in 60 minutes.' });
		}
	});

	it('counts concurrent hits exactly once each', async () => {
		const rule = { name: 'test:concurrent', points: 10, windowSeconds: 60 };
		await Promise.all(Array.from({ length: 12 }, () => hitLimit(rule, 'k')));
		expect(await checkLimit(rule, 'k')).toMatchObject({ points: 12, limited: true });
	});

	it('words the wait in seconds or whole minutes, rounded up', () => {
		expect(waitMessage(1)).toBe('Try again in 1 second.');
		expect(waitMessage(45)).toBe('Try again in 45 seconds.');
		expect(waitMessage(61)).toBe('Try again in 2 minutes.');
		expect(waitMessage(900)).toBe('Try again in 15 minutes.');
	});
});
