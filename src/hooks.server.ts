import { sequence } from '@sveltejs/kit/hooks';
import type { HandleServerError, ServerInit } from '@sveltejs/kit';
import { building } from '$app/environment';
import { themeHandle } from '$lib/server/theme';
import { authHandle } from '$lib/server/auth/handle';
import { faultHandle, handleFaultError } from '$lib/server/fault-handle';
import { securityHeadersHandle } from '$lib/server/security-headers';
import { callerHandle } from '$lib/server/request-caller';
import { startJobRunnerAtBoot, stopJobRunner } from '$lib/server/jobs/all-kinds';
import { takesJobs } from '$lib/server/config';

// securityHeadersHandle outermost, so every answer carries the headers, fault answers too;
// faultHandle next: it turns a database outage anywhere below (the session look-up included)
// into one 503 answer with Retry-After (see $lib/server/fault-handle.ts).
// callerHandle after auth: it names who is asking, for the analysis queue's fair share.
export const handle = sequence(securityHeadersHandle, faultHandle, authHandle, callerHandle, themeHandle);

export const handleError: HandleServerError = handleFaultError;

// Once per server process (SvelteKit guards against repeats), unless POLEWISE_ROLE=web (jobs
// then run in worker processes): take jobs from the queue right away, so a job queued before a
// restart does not wait for a design request. Not
// awaited, so a slow or absent database never holds up serving pages; `vite build` (which may
// load this file to prerender) is left out.
export const init: ServerInit = () => {
	if (building || !takesJobs()) return;
	void startJobRunnerAtBoot();
	// adapter-node emits this on SIGINT/SIGTERM: hand a running job back to the queue.
	process.once('sveltekit:shutdown', () => void stopJobRunner().catch(() => {}));
};
