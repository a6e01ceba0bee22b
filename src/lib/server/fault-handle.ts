// The one place where recognised faults (faults.ts) become their answers. `handleError` (in
// hooks.server.ts) sees every error SvelteKit catches — in loads, actions and endpoints — and
// notes the fault on `locals`; this handle, first in the sequence, then turns SvelteKit's 500
// into the fault's answer. Errors thrown before a route runs (e.g. the session look-up in the
// auth handle) reach this handle directly.
import type { Handle, HandleServerError } from '@sveltejs/kit';
import { classifyFault } from './faults';
import { faultResponse } from './fault-response';

export const faultHandle: Handle = async ({ event, resolve }) => {
	event.locals.fault = null;
	let response: Response;
	try {
		response = await resolve(event);
	} catch (error) {
		const fault = classifyFault(error);
		if (!fault) throw error;
		return faultResponse(event, fault);
	}
	const fault = event.locals.fault;
	if (fault && response.status >= 500) return faultResponse(event, fault, response);
	return response;
};

export const handleFaultError: HandleServerError = ({ error, event, status, message }) => {
	const fault = classifyFault(error);
	if (fault) {
		event.locals.fault = fault;
		if (fault.code === 'unavailable')
			console.warn(
				`[db] ${event.request.method} ${event.url.pathname}: database unavailable (${(error as Error)?.message ?? error})`
			);
		return { message: fault.message, code: fault.code };
	}
	// What SvelteKit would log without this hook: unexpected errors, not 404s.
	if (status >= 500) console.error(error);
	return { message };
};
