// Who is asking, resolved once per request: an `Authorization: Bearer pw_…` personal API token
// when the header is present (explicit credentials win, and a bad one is not rescued by a
// cookie), else the `pw_session` cookie. Requests with neither never touch the database.
import type { Handle } from '@sveltejs/kit';
import { userForApiToken } from '../db/tokens';
import { checkLimit, hitLimit, RULES, tooManyRequests } from '../rate-limit';
import { clientAddress } from './client-address';
import { clearSessionCookie, SESSION_COOKIE, setSessionCookie, validateSessionToken } from './session';

export const authHandle: Handle = async ({ event, resolve }) => {
	event.locals.user = null;
	event.locals.session = null;
	event.locals.auth = null;

	const header = event.request.headers.get('authorization');
	if (header !== null) {
		const match = /^Bearer\s+(\S+)\s*$/i.exec(header);
		const address = clientAddress(event);
		const limited = await checkLimit(RULES.badTokenAddress, address);
		if (limited.limited) return tooManyRequests(limited.retryAfterSeconds, 'Too many requests with an unknown API token.');
		const user = match ? await userForApiToken(match[1]) : null;
		if (user) {
			event.locals.user = user;
			event.locals.auth = 'token';
		} else {
			await hitLimit(RULES.badTokenAddress, address);
		}
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
