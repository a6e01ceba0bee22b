// Who is asking, resolved once per request: an `Authorization: Bearer pw_…` personal API token
// when the header is present (explicit credentials win, and a bad one is not rescued by a
// cookie), else the `pw_session` cookie. Requests with neither never touch the database.
import type { Handle } from '@sveltejs/kit';
import { userForApiToken } from '../db/tokens';
import { hitLimit, RULES, tooManyRequests, type RateState } from '../rate-limit';
import { hashSecret } from './secrets';
import { clientAddress } from './client-address';
import { clearSessionCookie, SESSION_COOKIE, setSessionCookie, validateSessionToken } from './session';

export const authHandle: Handle = async ({ event, resolve }) => {
	event.locals.user = null;
	event.locals.session = null;
	event.locals.auth = null;

	const header = event.request.headers.get('authorization');
	if (header !== null) {
		const presented = /^Bearer\s+(\S+)\s*$/i.exec(header)?.[1] ?? null;
		// A valid token is looked up first and always works: failures from the same address
		// (a NAT, a proxy, someone else's junk) can never lock out a good token.
		const user = presented ? await userForApiToken(presented) : null;
		if (user) {
			event.locals.user = user;
			event.locals.auth = 'token';
			return resolve(event);
		}
		const limited = await countBadToken(presented ?? header, clientAddress(event));
		if (limited) return tooManyRequests(limited.retryAfterSeconds, 'Too many requests with an unknown API token.');
		return resolve(event);
	}

	const token = event.cookies.get(SESSION_COOKIE);
	if (token) {
		const { session, user, renewed } = await validateSessionToken(token);
		if (session) {
			event.locals.user = user;
			event.locals.session = session;
			event.locals.auth = 'session';
			if (renewed) setSessionCookie(event.cookies, token, session.expiresAt, event.url);
		} else {
			clearSessionCookie(event.cookies, event.url);
		}
	}
	return resolve(event);
};

/**
 * Count one request with an unknown or revoked token, separately per presented token (a script
 * stuck on a revoked token slows down quickly) and per client address (guessing many tokens),
 * each in a short window. The answer is 429 only once a counter is over its limit; the token is
 * kept as its hash, never as text.
 */
async function countBadToken(presented: string, address: string): Promise<RateState | null> {
	const [byToken, byAddress] = await Promise.all([
		hitLimit(RULES.badToken, hashSecret(presented)),
		hitLimit(RULES.badTokenAddress, address)
	]);
	const over = [
		{ state: byToken, rule: RULES.badToken },
		{ state: byAddress, rule: RULES.badTokenAddress }
	].filter(({ state, rule }) => state.points > rule.points);
	if (over.length === 0) return null;
	return over.reduce((a, b) => (b.state.retryAfterSeconds > a.state.retryAfterSeconds ? b : a)).state;
}
