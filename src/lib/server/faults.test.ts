// Which failures mean "the database is not answering" (503) and which are the caller's (400):
// real error objects as Sequelize and pg raise them, and the answer each kind of request gets.
import { describe, expect, it } from 'vitest';
import {
	ConnectionAcquireTimeoutError,
	ConnectionRefusedError,
	DatabaseError,
	UniqueConstraintError
} from 'sequelize';
import type { RequestEvent } from '@sveltejs/kit';
import { classifyFault, RETRY_AFTER_SECONDS } from './faults';
import { faultResponse } from './fault-response';

const pgError = (message: string, code: string) => Object.assign(new Error(message), { code });
const wrapped = (e: Error) => new DatabaseError(e as never);

describe('classifyFault', () => {
	it.each([
		[
			'connection refused (server stopped)',
			new ConnectionRefusedError(pgError('connect ECONNREFUSED 127.0.0.1:5432', 'ECONNREFUSED'))
		],
		[
			'pool could not get a connection in time',
			new ConnectionAcquireTimeoutError(new Error('Operation timeout'))
		],
		[
			'server shutting down mid-query (57P01)',
			wrapped(pgError('terminating connection due to administrator command', '57P01'))
		],
		['server starting up (57P03)', wrapped(pgError('the database system is starting up', '57P03'))],
		['socket closed under a query', wrapped(new Error('Connection terminated unexpectedly'))],
		['connect timeout (packets dropped)', new Error('timeout exceeded when trying to connect')],
		['too many connections (53300)', wrapped(pgError('sorry, too many clients already', '53300'))]
	])('%s → 503 with Retry-After', (_, error) => {
		expect(classifyFault(error)).toMatchObject({
			status: 503,
			code: 'unavailable',
			retryAfterSeconds: RETRY_AFTER_SECONDS
		});
	});

	it('a malformed value PostgreSQL refuses (22P02) is the caller’s 400', () => {
		expect(
			classifyFault(wrapped(pgError('invalid input syntax for type uuid: "x"', '22P02')))
		).toMatchObject({ status: 400, code: 'bad_value' });
	});

	it.each([
		['a program error', new TypeError("Cannot read properties of undefined (reading 'id')")],
		['a unique violation', new UniqueConstraintError({})],
		['a syntax error in SQL', wrapped(pgError('syntax error at or near "FROM"', '42601'))],
		['not an error at all', 'boom']
	])('%s stays a 500', (_, error) => {
		expect(classifyFault(error)).toBeNull();
	});
});

describe('faultResponse', () => {
	const fault = classifyFault(
		new ConnectionRefusedError(pgError('connect ECONNREFUSED', 'ECONNREFUSED'))
	)!;
	const event = (path: string, headers: Record<string, string> = {}) =>
		({
			url: new URL(`http://127.0.0.1${path}`),
			request: new Request(`http://127.0.0.1${path}`, { headers }),
			isDataRequest: path.endsWith('/__data.json')
		}) as unknown as RequestEvent;

	it('answers the API in JSON', async () => {
		const r = faultResponse(event('/api/workspaces'), fault);
		expect(r.status).toBe(503);
		expect(r.headers.get('retry-after')).toBe(String(RETRY_AFTER_SECONDS));
		expect(await r.json()).toEqual({
			error: fault.message,
			code: 'unavailable',
			retryAfterSeconds: RETRY_AFTER_SECONDS
		});
	});

	it('answers a browser with a page of its own that retries without script', async () => {
		const r = faultResponse(event('/sheets/1', { accept: 'text/html' }), fault);
		expect(r.status).toBe(503);
		expect(r.headers.get('content-type')).toMatch(/^text\/html/);
		expect(r.headers.get('content-security-policy')).toContain("default-src 'none'");
		const html = await r.text();
		expect(html).toContain('Briefly unavailable');
		expect(html).toContain(`http-equiv="refresh" content="${RETRY_AFTER_SECONDS}"`);
		expect(html).not.toContain('<script');
	});

	it('keeps SvelteKit’s own format for form actions and data requests, with the fault’s status', async () => {
		const rendered = new Response('{"type":"error","error":{"message":"m"}}', {
			status: 500,
			headers: { 'content-type': 'application/json' }
		});
		const r = faultResponse(event('/sheets/1', { 'x-sveltekit-action': 'true' }), fault, rendered);
		expect(r.status).toBe(503);
		expect(r.headers.get('retry-after')).toBe(String(RETRY_AFTER_SECONDS));
		expect(await r.text()).toBe('{"type":"error","error":{"message":"m"}}');
		const data = faultResponse(event('/sheets/1/__data.json'), fault);
		expect(data.status).toBe(503);
		expect(await data.json()).toMatchObject({ type: 'error', error: { code: 'unavailable' } });
	});
});
