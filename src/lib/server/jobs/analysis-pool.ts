// The worker-thread pool for analyses. In the built server the worker is the bundled
// build/workers/analyze.worker.mjs (scripts/build-workers.mjs); under the Vite dev server and in
// tests it is the TypeScript source, run through tsx.
import { Piscina } from 'piscina';
import type { AnalyzeOutcome, AnalyzeTask } from '../workers/analyze.worker';
import { ApiProblem } from '../api/respond';
import { LIMITS } from '../analysis-request';
import { workerFile } from './worker-file';
import { config } from '../config';

let pool: Piscina | null = null;

export function analysisPool(): Piscina {
	if (!pool) {
		const { filename, execArgv } = workerFile('analyze', import.meta.url);
		pool = new Piscina({
			filename,
			execArgv,
			minThreads: 1,
			maxThreads: config().analysisThreads,
			idleTimeout: 60_000,
			// Bounded queue: beyond this the server answers 503 instead of piling up work.
			maxQueue: 64
		});
	}
	return pool;
}

/**
 * Run one analysis with a time limit; an overrun ends that worker thread (503), and so does a
 * full queue (503 with Retry-After) — the server stays responsive either way.
 */
export async function analyzeInPool(
	task: AnalyzeTask,
	timeoutMs = LIMITS.timeoutMs
): Promise<AnalyzeOutcome> {
	return runInPool(task, undefined, timeoutMs) as Promise<AnalyzeOutcome>;
}

/** Several networks (a sheet's variants) as one task, one outcome each, under one time limit. */
export async function analyzeManyInPool(
	task: { documents: unknown[]; options?: AnalyzeTask['options'] },
	timeoutMs = LIMITS.timeoutMs
): Promise<AnalyzeOutcome[]> {
	return runInPool(task, 'runMany', timeoutMs) as Promise<AnalyzeOutcome[]>;
}

async function runInPool(task: unknown, name: string | undefined, timeoutMs: number): Promise<unknown> {
	const signal = AbortSignal.timeout(timeoutMs);
	try {
		return await analysisPool().run(task, { signal, ...(name ? { name } : {}) });
	} catch (error) {
		if (signal.aborted) {
			throw new ApiProblem(
				503,
				`the analysis took longer than ${timeoutMs / 1000} s and was stopped`,
				{ code: 'timeout' }
			);
		}
		if (error instanceof Error && /queue is at limit/i.test(error.message)) {
			throw new ApiProblem(503, 'the server is busy with other analyses; try again in a moment', {
				code: 'busy'
			});
		}
		throw error;
	}
}

export async function closeAnalysisPool(): Promise<void> {
	await pool?.destroy();
	pool = null;
}
