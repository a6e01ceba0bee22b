// Who is asking, for admission control's fair share (jobs/admission.ts), without passing it
// through every function between a route and the worker pool: the hooks run each request inside
// this context. Outside a request (the job runner) there is no caller: background work.
import { AsyncLocalStorage } from 'node:async_hooks';
import type { Handle } from '@sveltejs/kit';
import { clientAddress } from './auth/client-address';

interface Caller {
	key: string;
	/** Not the request's own signal: adapter-node aborts that one spuriously for a GET whose
	 * (absent) body was never read, and never once a POST body has arrived, so it cannot tell
	 * whether a client went away. Waiting tasks are bounded by the queue's wait limit instead. */
	signal?: AbortSignal;
}

const store = new AsyncLocalStorage<Caller>();

export const currentCaller = (): Caller | null => store.getStore() ?? null;

/** Run `fn` as `key` (tests and scripts; the hook below does it for requests). */
export const asCaller = <T>(key: string, fn: () => T, signal?: AbortSignal): T =>
	store.run({ key, signal }, fn);

/** After the auth handle: a signed-in person (cookie or token) is one caller wherever they
 * come from; anyone else (a read-only link, signed out) is their address. */
export const callerHandle: Handle = ({ event, resolve }) =>
	store.run(
		{ key: event.locals.user ? `user:${event.locals.user.id}` : `address:${clientAddress(event)}` },
		() => resolve(event)
	);
