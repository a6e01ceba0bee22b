import { sequence } from '@sveltejs/kit/hooks';
import type { ServerInit } from '@sveltejs/kit';
import { building } from '$app/environment';
import { themeHandle } from '$lib/server/theme';
import { authHandle } from '$lib/server/auth/handle';
import { startDesignRunnerAtBoot, stopDesignQueue } from '$lib/server/jobs/design-queue';

export const handle = sequence(authHandle, themeHandle);

// Once per server process (SvelteKit guards against repeats): take tolerance runs from the
// queue right away, so a job queued before a restart does not wait for a design request. Not
// awaited, so a slow or absent database never holds up serving pages; `vite build` (which may
// load this file to prerender) is left out.
export const init: ServerInit = () => {
	if (building) return;
	void startDesignRunnerAtBoot();
	// adapter-node emits this on SIGINT/SIGTERM: let a running chunk finish and release the job.
	process.once('sveltekit:shutdown', () => void stopDesignQueue().catch(() => {}));
};
