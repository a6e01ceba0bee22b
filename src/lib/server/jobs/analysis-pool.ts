// The worker-thread pool for analyses. In the built server the worker is the bundled
// build/workers/analyze.worker.mjs (scripts/build-workers.mjs); under the Vite dev server and in
// tests it is the TypeScript source, run through tsx.
import { existsSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { Piscina } from 'piscina';
import type { AnalyzeOutcome, AnalyzeTask } from '../workers/analyze.worker';

let pool: Piscina | null = null;

function workerFile(): { filename: string; execArgv: string[] } {
	const here = path.dirname(fileURLToPath(import.meta.url));
	const source = path.join(here, '..', 'workers', 'analyze.worker.ts');
	if (existsSync(source)) return { filename: source, execArgv: ['--import', 'tsx'] };
	// Built: this chunk sits somewhere below build/server; the workers sit in build/workers.
	let dir = here;
	for (let i = 0; i < 6; i++) {
		const candidate = path.join(dir, 'workers', 'analyze.worker.mjs');
		if (existsSync(candidate)) return { filename: candidate, execArgv: [] };
		dir = path.dirname(dir);
	}
	throw new Error('analysis worker not found: run `npm run build` (it bundles build/workers)');
}

export function analysisPool(): Piscina {
	if (!pool) {
		const { filename, execArgv } = workerFile();
		pool = new Piscina({
			filename,
			execArgv,
			minThreads: 1,
			maxThreads: Number(process.env.ANALYSIS_THREADS ?? Math.max(1, os.availableParallelism() - 1)),
			idleTimeout: 60_000,
			// Bounded queue: beyond this the server answers 503 instead of piling up work.
			maxQueue: 64
		});
	}
	return pool;
}

export class AnalysisTimeout extends Error {}

/** Run one analysis with a time limit; an overrun ends that worker thread. */
export async function runAnalysis(task: AnalyzeTask, timeoutMs: number): Promise<AnalyzeOutcome> {
	const signal = AbortSignal.timeout(timeoutMs);
	try {
		return (await analysisPool().run(task, { signal })) as AnalyzeOutcome;
	} catch (error) {
		if (signal.aborted) throw new AnalysisTimeout(`analysis took longer than ${timeoutMs / 1000} s`);
		throw error;
	}
}

export async function closeAnalysisPool(): Promise<void> {
	await pool?.destroy();
	pool = null;
}
