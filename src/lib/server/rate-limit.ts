// Rate limits kept in PostgreSQL: app processes are stateless behind a load balancer, so a
// counter in memory would let an attacker spread attempts across them. Fixed windows: the first
// hit opens a window of `windowSeconds`; at `points` hits the key is limited until it closes.
// A small table of our own (one upsert per hit) instead of another dependency.
import { json } from '@sveltejs/kit';
import { QueryTypes } from 'sequelize';
import { db } from './db/connection';
import { config } from './config';

export interface RateRule {
	name: string;
	points: number;
	windowSeconds: number;
}

const MINUTES = 60;
export const RULES = {
	/** Failed sign-ins against one e-mail address, from anywhere. */
	signInAccount: { name: 'sign-in:account', points: 5, windowSeconds: 15 * MINUTES },
	/** Failed sign-ins from one client address, against any accounts. */
	signInAddress: { name: 'sign-in:address', points: 20, windowSeconds: 15 * MINUTES },
	/** Reset e-mails requested for one address (known or not: the answer must not differ). */
	resetAccount: { name: 'reset:account', points: 3, windowSeconds: 60 * MINUTES },
	resetAddress: { name: 'reset:address', points: 10, windowSeconds: 60 * MINUTES },
	/** New accounts per client address. Configurable because the browser test suite signs up
	 * many people from 127.0.0.1 within one hour (npm test raises it for that run only). */
	signUpAddress: {
		name: 'sign-up:address',
		get points() {
			return config().signupsPerHour;
		},
		windowSeconds: 60 * MINUTES
	},
	/** Sign-ups for one e-mail address (each sends that address a mail, known or not). */
	signUpAccount: { name: 'sign-up:account', points: 3, windowSeconds: 60 * MINUTES },
	/** Requests with an unknown or revoked API token, per client address: short, because a
	 * valid token is checked before any limit and so never suffers from it. */
	badTokenAddress: { name: 'api-token:address', points: 30, windowSeconds: MINUTES },
	/** Requests with one and the same unknown or revoked token, from anywhere (keyed by its hash). */
	badToken: { name: 'api-token:token', points: 5, windowSeconds: MINUTES }
} satisfies Record<string, RateRule>;

export interface RateState {
	/** Hits in the current window, including this one for `hitLimit`. */
	points: number;
	limited: boolean;
	/** Seconds until the window closes (0 when no window is open). */
	retryAfterSeconds: number;
}

const keyOf = (rule: RateRule, key: string) => `${rule.name}:${key.toLowerCase()}`.slice(0, 300);

/** Count one hit (a failure, a request) against the key. */
export async function hitLimit(rule: RateRule, key: string): Promise<RateState> {
	const [row] = await db().query<{ points: number; wait: number }>(
		`INSERT INTO rate_limits (key, points, expires_at) VALUES (:key, 1, now() + make_interval(secs => :window))
		 ON CONFLICT (key) DO UPDATE SET
		   points = CASE WHEN rate_limits.expires_at <= now() THEN 1 ELSE rate_limits.points + 1 END,
		   expires_at = CASE WHEN rate_limits.expires_at <= now() THEN EXCLUDED.expires_at ELSE rate_limits.expires_at END
		 RETURNING points, CEIL(EXTRACT(EPOCH FROM (expires_at - now())))::int AS wait`,
		{ replacements: { key: keyOf(rule, key), window: rule.windowSeconds }, type: QueryTypes.SELECT }
	);
	if (Math.random() < 0.01) void sweep();
	return { points: row.points, limited: row.points >= rule.points, retryAfterSeconds: Math.max(0, row.wait) };
}

/** Is the key limited now? Does not count a hit. */
export async function checkLimit(rule: RateRule, key: string): Promise<RateState> {
	const [row] = await db().query<{ points: number; wait: number }>(
		`SELECT points, CEIL(EXTRACT(EPOCH FROM (expires_at - now())))::int AS wait FROM rate_limits WHERE key = :key AND expires_at > now()`,
		{ replacements: { key: keyOf(rule, key) }, type: QueryTypes.SELECT }
	);
	if (!row) return { points: 0, limited: false, retryAfterSeconds: 0 };
	return { points: row.points, limited: row.points >= rule.points, retryAfterSeconds: Math.max(0, row.wait) };
}

/** The first limited key among several (e.g. account and client address), or null. */
export async function firstLimited(checks: [RateRule, string][]): Promise<RateState | null> {
	for (const [rule, key] of checks) {
		const state = await checkLimit(rule, key);
		if (state.limited) return state;
	}
	return null;
}

export async function clearLimit(rule: RateRule, key: string): Promise<void> {
	await db().query(`DELETE FROM rate_limits WHERE key = :key`, { replacements: { key: keyOf(rule, key) } });
}

async function sweep() {
	await db()
		.query(`DELETE FROM rate_limits WHERE expires_at < now() - interval '1 hour'`)
		.catch(() => undefined);
}

/** "Try again in 14 minutes." — rounded up, so the wait is never shorter than said. */
export function waitMessage(seconds: number): string {
	if (seconds < 60) return `Try again in ${Math.max(1, seconds)} second${seconds === 1 ? '' : 's'}.`;
	const minutes = Math.ceil(seconds / 60);
	return `Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`;
}

/** A 429 JSON answer for the API, with Retry-After. */
export function tooManyRequests(retryAfterSeconds: number, what = 'Too many attempts.'): Response {
	return json({ message: `${what} ${waitMessage(retryAfterSeconds)}`, retryAfterSeconds }, { status: 429, headers: { 'retry-after': String(retryAfterSeconds) } });
}
