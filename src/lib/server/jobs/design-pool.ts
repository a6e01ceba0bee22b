// The worker-thread pool for the design aids: separate from the analysis pool so a ten-thousand
// run tolerance job never queues the editor's live analyses behind it. Built: the bundled
// build/workers/design.worker.mjs; dev and tests: the TypeScript source through tsx.
import { Piscina } from 'piscina';
import { workerFile } from './worker-file';
import type { DesignOutcome, DesignTask } from '../workers/design.worker';
import { ApiProblem } from '../api/respond';
import { config } from '../config';

let pool: Piscina | null = null;

export function designPool(): Piscina {
	if (!pool) {
		const { filename, execArgv } = workerFile('design', import.meta.url);
		// One thread by default: design requests are rarer than analyses, and a 2-core machine
		// must keep a core for the server and the analysis pool.
		pool = new Piscina({
			filename,
			execArgv,
			minThreads: 1,
			maxThreads: config().designThreads,
			idleTimeout: 60_000,
			maxQueue: 32
		});
	}
	return pool;
}

/** One design task under a time limit; a refusal by the solver or the design aids is 422. */
export async function runDesign(
	task: DesignTask,
	timeoutMs = config().designTimeoutMs,
	stop?: AbortSignal
): Promise<unknown> {
	const timeout = AbortSignal.timeout(timeoutMs);
	// `stop`: a background job that must end (cancelled, taken over) ends its chunk at once.
	const signal = stop ? AbortSignal.any([timeout, stop]) : timeout;
	let outcome: DesignOutcome;
	try {
		outcome = (await designPool().run(task, { signal })) as DesignOutcome;
	} catch (error) {
		if (stop?.aborted) throw stop.reason;
		if (signal.aborted)
			throw new ApiProblem(
				503,
				`the ${task.kind} took longer than ${timeoutMs / 1000} s and was stopped`,
				{ code: 'timeout' }
			);
		if (error instanceof Error && /queue is at limit/i.test(error.message)) {
			throw new ApiProblem(
				503,
				'the server is busy with other design runs; try again in a moment',
				{ code: 'busy' }
			);
		}
		throw error;
	}
	if (!outcome.ok) {
		const { error, ...where } = outcome.error;
		throw new ApiProblem(422, error, where);
	}
	return outcome.value;
}

export async function closeDesignPool(): Promise<void> {
	await pool?.destroy();
	pool = null;
}
