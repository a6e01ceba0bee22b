// The worker-thread pool for analyses. In the built server the worker is the bundled
// build/workers/analyze.worker.mjs (scripts/build-workers.mjs); under the Vite dev server and in
// tests it is the TypeScript source, run through tsx.
import { Piscina } from 'piscina';
import type { AnalyzeOutcome, AnalyzeTask } from '../workers/analyze.worker';
import { ApiProblem } from '../api/respond';
import { LIMITS } from '../analysis-request';
import { workerFile } from './worker-file';
import { config } from '../config';
import { requireInteractive } from '../analysis-limits';
import { currentCaller } from '../request-caller';
import { Admission } from './admission';

let pool: Piscina | null = null;

export function analysisPool(): Piscina {
	if (!pool) {
		const { filename, execArgv } = workerFile('analyze', import.meta.url);
		const threads = config().analysisThreads;
		pool = new Piscina({
			filename,
			execArgv,
			// Every thread ready from the start: admission hands a task over only when a thread
			// is free, and its time limit starts then, so starting a thread must not count.
			minThreads: threads,
			maxThreads: threads,
			idleTimeout: 60_000,
			// Admission control (below) keeps this queue empty; the bound is a last guard.
			maxQueue: 64
		});
	}
	return pool;
}

/** Who may run when: one task per thread, fair share per caller, shedding (jobs/admission.ts). */
export const analysisAdmission = new Admission('analyses', () => {
	const c = config();
	return {
		concurrency: c.analysisThreads,
		maxQueue: c.analysisQueue,
		perCaller: c.analysisPerCaller,
		maxWaitMs: c.analysisQueueWaitMs
	};
});

/**
 * Run one analysis: refused up front (413) when the network is too large for a request,
 * admitted by turn (503/429 with Retry-After when the server is busy), then run with a time
 * limit that counts its own running time only; an overrun ends that worker thread (503).
 */
export async function analyzeInPool(
	task: AnalyzeTask,
	timeoutMs = LIMITS.timeoutMs
): Promise<AnalyzeOutcome> {
	requireInteractive(task.document);
	return runAdmitted(task, undefined, timeoutMs) as Promise<AnalyzeOutcome>;
}

/** Several networks (a sheet's variants) as one task, one outcome each, under one time limit. */
export async function analyzeManyInPool(
	task: { documents: unknown[]; options?: AnalyzeTask['options'] },
	timeoutMs = LIMITS.timeoutMs
): Promise<AnalyzeOutcome[]> {
	task.documents.forEach((d, i) =>
		requireInteractive(d, task.documents.length > 1 ? `network ${i + 1}` : undefined)
	);
	return runAdmitted(task, 'runMany', timeoutMs) as Promise<AnalyzeOutcome[]>;
}

/** Any other solver task in the analysis threads (e.g. two-port parameters for Touchstone). */
export async function runSolverTask<T>(
	name: string,
	task: { document: unknown; [more: string]: unknown },
	timeoutMs = LIMITS.timeoutMs
): Promise<T> {
	requireInteractive(task.document);
	return runAdmitted(task, name, timeoutMs) as Promise<T>;
}

/** Refuse now, before the body is read, when the analysis would be refused anyway (overload). */
export function shedEarly(): void {
	const refused = analysisAdmission.refusal(currentCaller()?.key ?? null);
	if (refused) throw refused;
}

async function runAdmitted(
	task: unknown,
	name: string | undefined,
	timeoutMs: number
): Promise<unknown> {
	const caller = currentCaller();
	// A refusal (Shed) is an ApiProblem already: 503 busy or 429 with Retry-After.
	return analysisAdmission.run(
		caller?.key ?? null,
		() => runTimed(task, name, timeoutMs),
		caller?.signal
	);
}

async function runTimed(
	task: unknown,
	name: string | undefined,
	timeoutMs: number
): Promise<unknown> {
	// A thread ended by an overrun is replaced, and starting one (loading the solver) must not
	// count either: a no-op round trip waits until a thread is up. Admission keeps one task per
	// thread, so the task below then starts at once.
	await analysisPool().run(null, { name: 'ready' });
	// The clock starts here, when a thread is free: waiting in line never counts.
	const signal = AbortSignal.timeout(timeoutMs);
	try {
		return await analysisPool().run(task, { signal, ...(name ? { name } : {}) });
	} catch (error) {
		if (signal.aborted) {
			throw new ApiProblem(
				503,
				`the analysis ran for ${timeoutMs / 1000} s, the limit for one request, and was stopped: this network takes too long to analyse here`,
				{ code: 'timeout' }
			);
		}
		if (error instanceof Error && /queue is at limit/i.test(error.message)) {
			throw new ApiProblem(503, 'the server is busy with other analyses; try again in a moment', {
				code: 'busy',
				retryAfterSeconds: analysisAdmission.retryAfterSeconds()
			});
		}
		throw error;
	}
}

export async function closeAnalysisPool(): Promise<void> {
	await pool?.destroy();
	pool = null;
}
