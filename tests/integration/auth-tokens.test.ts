// Personal API tokens through the real hooks: Bearer pw_… resolves to the person on an API
// handler guarded by requireApiUser, records last use, and stops working once revoked.
import { describe, expect, it } from 'vitest';
import { isHttpError, json } from '@sveltejs/kit';
import { useDatabase } from './support/database';
import { person, requestEvent } from './support/auth-helpers';
import { db } from '../../src/lib/server/db/connection';
import { authHandle } from '../../src/lib/server/auth/handle';
import { requireApiUser } from '../../src/lib/server/auth/guard';
import { createSession, SESSION_COOKIE } from '../../src/lib/server/auth/session';
import { createApiToken, listApiTokens, revokeApiToken } from '../../src/lib/server/db/tokens';
import { hashSecret } from '../../src/lib/server/auth/secrets';

useDatabase();

// An API handler as a +server.ts would write it.
const whoAmI = ({ locals }: { locals: App.Locals }) => json({ id: requireApiUser(locals).id, auth: locals.auth });

const call = (headers: Record<string, string>, cookies?: Map<string, string>) => callFrom(undefined, headers, cookies);

async function callFrom(ip: string | undefined, headers: Record<string, string>, cookies?: Map<string, string>) {
	const { event, cookies: jar } = requestEvent({ url: 'http://127.0.0.1:4173/api/whoami', headers, ip });
	for (const [k, v] of cookies ?? []) jar.values.set(k, v);
	try {
		return await authHandle({ event, resolve: async (e) => whoAmI(e) });
	} catch (e) {
		if (isHttpError(e)) return json(e.body, { status: e.status });
		throw e;
	}
}

describe('API tokens', () => {
	it('authenticates a Bearer token, stores only its hash, and stops after revocation', async () => {
		const ana = await person('token-ana');
		const { token, info } = await createApiToken(ana.id, 'nightly run');
		expect(token).toMatch(/^pw_[a-z2-7]{32}$/);
		const [rows] = await db().query(`SELECT token_hash, prefix FROM api_tokens`);
		expect(rows).toEqual([{ token_hash: hashSecret(token), prefix: token.slice(0, 9) }]);

		const ok = await call({ authorization: `Bearer ${token}` });
		expect(ok.status).toBe(200);
		expect(await ok.json()).toEqual({ id: ana.id, auth: 'token' });
		expect((await listApiTokens(ana.id))[0].lastUsedAt).toBeInstanceOf(Date);

		const stranger = await person('token-stranger');
		expect(await revokeApiToken(stranger.id, info.id)).toBeNull();
		expect(await revokeApiToken(ana.id, info.id)).toBe('nightly run');
		const refused = await call({ authorization: `Bearer ${token}` });
		expect(refused.status).toBe(401);
		expect(await refused.json()).toEqual({ message: 'Sign in or send an API token' });
		expect(await listApiTokens(ana.id)).toEqual([]);
	});

	it('answers 401 with no credentials or a malformed header, and accepts the session cookie', async () => {
		const ana = await person('token-cookie');
		expect((await call({})).status).toBe(401);
		expect((await call({ authorization: 'Basic YW5hOnB3' })).status).toBe(401);
		const { token } = await createSession(ana.id);
		const bySession = await call({}, new Map([[SESSION_COOKIE, token]]));
		expect(await bySession.json()).toEqual({ id: ana.id, auth: 'session' });
		// Explicit credentials win: a bad token is not rescued by a good cookie.
		expect((await call({ authorization: 'Bearer pw_wrong' }, new Map([[SESSION_COOKIE, token]]))).status).toBe(401);
	});

	it('answers 429 with a short wait after 30 unknown tokens from one address', async () => {
		for (let i = 0; i < 30; i++) expect((await call({ authorization: `Bearer pw_guess${i}` })).status).toBe(401);
		const limited = await call({ authorization: 'Bearer pw_guess-again' });
		expect(limited.status).toBe(429);
		expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(0);
		expect(Number(limited.headers.get('retry-after'))).toBeLessThanOrEqual(60);
		expect((await limited.json()).message).toMatch(/^Too many requests with an unknown API token\. Try again in (\d+ seconds?|1 minute)\.$/);
	});

	// Issue 14: 31 junk tokens from one address used to shut out every valid token from it (the
	// limit was counted before the token was checked), e.g. all integrations behind one NAT.
	it('never locks out a valid token, however many junk tokens its address sent', async () => {
		const ana = await person('token-nat');
		const { token } = await createApiToken(ana.id, 'ci behind the office NAT');
		for (let i = 0; i < 40; i++) await call({ authorization: `Bearer pw_junk${i}` });
		expect((await call({ authorization: 'Bearer pw_junk-more' })).status).toBe(429);
		const ok = await call({ authorization: `Bearer ${token}` });
		expect(ok.status).toBe(200);
		expect(await ok.json()).toEqual({ id: ana.id, auth: 'token' });
	});

	it('limits one stuck token on its own, from any address, without touching others', async () => {
		const from = (ip: string, token: string) => callFrom(ip, { authorization: `Bearer ${token}` });
		for (let i = 0; i < 5; i++) expect((await from(`198.51.100.${i}`, 'pw_revoked-long-ago')).status).toBe(401);
		const limited = await from('198.51.100.99', 'pw_revoked-long-ago');
		expect(limited.status).toBe(429);
		expect(limited.headers.get('retry-after')).toMatch(/^\d+$/);
		// Another unknown token from that address is only unknown (401), not limited.
		expect((await from('198.51.100.99', 'pw_some-other')).status).toBe(401);
	});
});
