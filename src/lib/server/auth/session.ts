// Sessions in PostgreSQL, the pattern lucia's documentation now recommends on @oslojs: the
// cookie holds a random token, the `sessions` row is keyed by its SHA-256, and the expiry slides
// forward while the session is in use. See docs/security.md.
import type { Cookies } from '@sveltejs/kit';
import { Op } from 'sequelize';
import { models } from '../db/models';
import { hashSecret, randomSecret } from './secrets';

export const SESSION_COOKIE = 'pw_session';
const DAY = 24 * 60 * 60 * 1000;
export const SESSION_LIFETIME_MS = 30 * DAY;
/** A session used with less than this left is extended to a full lifetime again. */
export const SESSION_RENEW_BELOW_MS = 15 * DAY;

export interface SessionUser {
	id: string;
	email: string;
	name: string;
}
export interface SessionInfo {
	id: string;
	expiresAt: Date;
}
export type SessionValidation = { session: SessionInfo; user: SessionUser; renewed: boolean } | { session: null; user: null; renewed: false };

/** Start a session: returns the token for the cookie (never stored) and the row's expiry. */
export async function createSession(userId: string): Promise<{ token: string; session: SessionInfo }> {
	const { Session } = models();
	const token = randomSecret();
	const expiresAt = new Date(Date.now() + SESSION_LIFETIME_MS);
	const row = await Session.create({ id: hashSecret(token), userId, expiresAt });
	return { token, session: { id: row.id, expiresAt } };
}

export async function validateSessionToken(token: string): Promise<SessionValidation> {
	const none = { session: null, user: null, renewed: false } as const;
	if (!token || token.length > 64) return none;
	const { Session, User } = models();
	const row = await Session.findByPk(hashSecret(token), {
		include: [{ model: User, as: 'user', attributes: ['id', 'email', 'name'] }]
	});
	const user = row && (row as unknown as { user: SessionUser | null }).user;
	if (!row || !user) return none;
	const now = Date.now();
	if (row.expiresAt.getTime() <= now) {
		await row.destroy();
		return none;
	}
	let renewed = false;
	if (row.expiresAt.getTime() - now < SESSION_RENEW_BELOW_MS) {
		row.expiresAt = new Date(now + SESSION_LIFETIME_MS);
		await row.save();
		renewed = true;
	}
	return { session: { id: row.id, expiresAt: row.expiresAt }, user: { id: user.id, email: user.email, name: user.name }, renewed };
}

export async function invalidateSession(id: string): Promise<void> {
	await models().Session.destroy({ where: { id } });
}

/** End every session of a user (password changed or reset, "sign out everywhere"). */
export async function invalidateUserSessions(userId: string, options: { except?: string } = {}): Promise<number> {
	const where = options.except ? { userId, id: { [Op.ne]: options.except } } : { userId };
	return models().Session.destroy({ where });
}

/**
 * Cookie options. SvelteKit already defaults to httpOnly, SameSite=Lax and Secure except on
 * http://localhost; given the request URL we also drop Secure on http://127.0.0.1, where the
 * tests and `npm start` serve (a spread `undefined` would erase the default, so build it up).
 */
function cookieOptions(url?: URL) {
	const options: { path: string; httpOnly: true; sameSite: 'lax'; secure?: boolean } = { path: '/', httpOnly: true, sameSite: 'lax' };
	if (url) {
		const loopback = url.hostname === 'localhost' || url.hostname === '[::1]' || url.hostname.startsWith('127.');
		options.secure = !(loopback && url.protocol === 'http:');
	}
	return options;
}

export function setSessionCookie(cookies: Cookies, token: string, expiresAt: Date, url?: URL): void {
	cookies.set(SESSION_COOKIE, token, { ...cookieOptions(url), expires: expiresAt });
}

export function clearSessionCookie(cookies: Cookies, url?: URL): void {
	cookies.delete(SESSION_COOKIE, cookieOptions(url));
}
