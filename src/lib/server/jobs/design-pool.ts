// The worker-thread pool for the design aids: separate from the analysis pool so a ten-thousand
// run tolerance job never queues the editor's live analyses behind it. Built: the bundled
// build/workers/design.worker.mjs; dev and tests: the TypeScript source through tsx.
import { Piscina } from 'piscina';
import { workerFile } from './worker-file';
import type { DesignOutcome, DesignTask } from '../workers/design.worker';
import { ApiProblem } from '../api/respond';
import { config } from '../config';
import { requireInteractive } from '../analysis-limits';
import { currentCaller } from '../request-caller';
import { Admission } from './admission';

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

/** The same admission rules as analyses (jobs/admission.ts), over the design threads. Tolerance
 * runs from the job queue have no caller: they wait their turn and are never shed. */
export const designAdmission = new Admission('design runs', () => {
	const c = config();
	return {
		concurrency: c.designThreads,
		maxQueue: c.analysisQueue,
		perCaller: c.analysisPerCaller,
		maxWaitMs: c.analysisQueueWaitMs
	};
});

/** Refuse now, before a (up to 2 MB) body is read, when the run would be refused anyway. */
export function shedDesignEarly(): void {
	const refused = designAdmission.refusal(currentCaller()?.key ?? null);
	if (refused) throw refused;
}

/** One design task: too-large networks refused (413), admitted by turn, then run under a time
 * limit that counts running time only; a refusal by the solver or the design aids is 422.
 * `stop`: a background job that must end (cancelled, taken over) leaves the line or ends its
 * chunk at once. */
export async function runDesign(
	task: DesignTask,
	timeoutMs = config().designTimeoutMs,
	stop?: AbortSignal,
	/** Objects moved to the worker (e.g. a progress MessagePort). */
	transferList?: Transferable[]
): Promise<unknown> {
	const caller = currentCaller();
	// Within a request, the interactive size limit; a background job (no caller) is where a
	// large network belongs, so it is not held to it.
	if (caller) requireInteractive((task as { document?: unknown }).document);
	let outcome: DesignOutcome;
	try {
		outcome = await designAdmission.run(
			caller?.key ?? null,
			() => runTimed(task, timeoutMs, stop, transferList),
			stop ?? caller?.signal
		);
	} catch (e) {
		if (stop?.aborted) throw stop.reason;
		throw e; // a refusal (Shed) is an ApiProblem already
	}
	if (!outcome.ok) {
		const { error, ...where } = outcome.error;
		throw new ApiProblem(422, error, where);
	}
	return outcome.value;
}

async function runTimed(
	task: DesignTask,
	timeoutMs: number,
	stop?: AbortSignal,
	transferList?: Transferable[]
): Promise<DesignOutcome> {
	// A replaced thread's start-up does not count either (see analysis-pool.ts).
	await designPool().run(null, { name: 'ready' });
	// The clock starts here, when a thread is free: waiting in line never counts.
	const timeout = AbortSignal.timeout(timeoutMs);
	const signal = stop ? AbortSignal.any([timeout, stop]) : timeout;
	try {
		return (await designPool().run(task, {
			signal,
			...(transferList ? { transferList: transferList as never } : {})
		})) as DesignOutcome;
	} catch (error) {
		if (stop?.aborted) throw stop.reason;
		if (signal.aborted)
			throw new ApiProblem(
				503,
				`the ${task.kind} ran for ${timeoutMs / 1000} s, the limit for one request, and was stopped`,
				{ code: 'timeout' }
			);
		if (error instanceof Error && /queue is at limit/i.test(error.message)) {
			throw new ApiProblem(
				503,
				'the server is busy with other design runs; try again in a moment',
				{
					code: 'busy',
					retryAfterSeconds: designAdmission.retryAfterSeconds()
				}
			);
		}
		throw error;
	}
}

export async function closeDesignPool(): Promise<void> {
	await pool?.destroy();
	pool = null;
}
