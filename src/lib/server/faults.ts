// Failures that are not the program's fault, recognised in one place (hooks.server.ts uses this
// for every page, form, data request and API route): the database not answering is a 503 with
// Retry-After that says the service is briefly unavailable, and PostgreSQL refusing a value's
// form (22P02, e.g. a malformed id a route forgot to check) is the caller's 400. Anything else
// stays a 500. Recovery needs nothing: Sequelize's pool opens new connections once the
// database answers again.
import { ApiProblem } from './api/respond';

export interface Fault {
	status: number;
	/** 'unavailable', 'bad_value', or the code of an ApiProblem ('busy', 'too_large', …). */
	code: string;
	message: string;
	retryAfterSeconds?: number;
}

/** Long enough for a restart or fail-over to finish, short enough that nobody gives up. */
export const RETRY_AFTER_SECONDS = 5;

export const UNAVAILABLE_MESSAGE =
	'Polewise is briefly unavailable: its database is not answering. Try again in a few seconds; what was saved before is safe, a change not confirmed as saved was not saved.';

// Sequelize's connection errors (refused, host unreachable, timed out, pool acquire timeout …)
// all share this prefix in their names; the codes are pg's and the socket's for a database that
// is down, restarting or shutting down (PostgreSQL error classes 08 and 57P, and 53300).
const CONNECTION_ERROR =
	/^Sequelize(Connection\w*|HostNot\w+|InvalidConnection|AccessDenied)Error$/;
const UNAVAILABLE_CODES = new Set([
	'ECONNREFUSED',
	'ECONNRESET',
	'ETIMEDOUT',
	'EHOSTUNREACH',
	'ENETUNREACH',
	'ENOTFOUND',
	'EPIPE',
	'EAI_AGAIN',
	'57P01',
	'57P02',
	'57P03',
	'53300'
]);
const UNAVAILABLE_TEXT =
	/Connection terminated|connection timeout|terminating connection|the database system is (starting up|shutting down)|Client has encountered a connection error|timeout exceeded when trying to connect/i;

/** The error and whatever it wraps (Sequelize's `parent`/`original`, `cause`), a few levels deep. */
function* chain(error: unknown): Generator<Record<string, unknown>> {
	let e = error;
	for (let depth = 0; depth < 5 && e && typeof e === 'object'; depth++) {
		const record = e as Record<string, unknown>;
		yield record;
		e = record.parent ?? record.original ?? record.cause;
	}
}

export function classifyFault(error: unknown): Fault | null {
	// A refusal the API would answer with its own status (a busy analysis queue, a network too
	// large to analyse) keeps that status when a page load meets it, instead of becoming a 500.
	if (error instanceof ApiProblem && ((error.status >= 400 && error.status < 500) || error.status === 503)) {
		const retry = error.details.retryAfterSeconds;
		return { status: error.status, code: String(error.details.code ?? 'refused'), message: error.message, ...(typeof retry === 'number' ? { retryAfterSeconds: retry } : {}) };
	}
	for (const e of chain(error)) {
		const code = typeof e.code === 'string' ? e.code : '';
		const name = typeof e.name === 'string' ? e.name : '';
		const message = typeof e.message === 'string' ? e.message : '';
		if (
			CONNECTION_ERROR.test(name) ||
			UNAVAILABLE_CODES.has(code) ||
			code.startsWith('08') ||
			UNAVAILABLE_TEXT.test(message)
		) {
			return {
				status: 503,
				code: 'unavailable',
				message: UNAVAILABLE_MESSAGE,
				retryAfterSeconds: RETRY_AFTER_SECONDS
			};
		}
		if (code === '22P02') {
			return {
				status: 400,
				code: 'bad_value',
				message: 'A value in the request is not in the form its field needs (ids are UUIDs).'
			};
		}
	}
	return null;
}
