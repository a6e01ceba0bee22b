// The design aids inside a worker thread, so a long sweep or a Monte Carlo chunk never blocks
// the server. A Monte Carlo job sends its runs in chunks; the opened network (validated and
// assembled once) is kept here between chunks of the same job, so the structure is reused
// across all runs of a job, not rebuilt per chunk.
import { analyze, SolverError } from '../../solver';
import type { MessagePort } from 'node:worker_threads';

/** What a queued large-network analysis asks for (jobs/large-analysis.ts). */
export interface LargeAnalysisOptions {
	poles?: number;
	near?: number;
	/** Frequency-response points; 0 skips the response and the step. */
	points?: number;
}
import { DesignError } from '../../design/errors';
import { sweep, type SweepRequest } from '../../design/sweep';
import { solveForValue, type SolveRequest } from '../../design/solve-for-value';
import { sensitivity } from '../../design/sensitivity';
import { worstCase, type WorstCaseRequest } from '../../design/worst-case';
import {
	checkTolerances,
	monteCarloChunk,
	summarize,
	type MonteCarloRequest,
	type RunRecord
} from '../../design/tolerance';
import { evaluateWith, openVariants, type Variants } from '../../design/variants';
import { checkSpec, optionsFor } from '../../design/spec-limits';
import { metricsOf } from '../../design/evaluate';
import type { CrossSpec, SpecLimits } from '../../network/design-schema';
import type { NetworkDocument } from '../../network/schema';
import { VariantError } from '../../network/variants';
import { judgeVariants } from '../../design/variant-spec';
import { yieldToServerThread } from './thread-priority';

// Pages and saves first: this thread computes at a lower priority than the server's.
yieldToServerThread();

export type DesignTask =
	| { kind: 'sweep'; document: unknown; request: SweepRequest }
	| { kind: 'solve'; document: unknown; request: SolveRequest }
	| { kind: 'sensitivity'; document: unknown }
	| { kind: 'worst-case'; document: unknown; request: WorstCaseRequest }
	| { kind: 'spec'; document: unknown; spec: SpecLimits }
	| { kind: 'variant-spec'; document: unknown; spec: SpecLimits; across: CrossSpec[] }
	| {
			kind: 'mc-chunk';
			key: string;
			document: unknown;
			request: MonteCarloRequest;
			from: number;
			to: number;
	  }
	| {
			/** A large network's analysis (the sparse back end), reporting progress on `progress`. */
			kind: 'large-analysis';
			document: unknown;
			options: LargeAnalysisOptions;
			progress?: MessagePort;
	  }
	| {
			kind: 'mc-summary';
			key: string;
			document: unknown;
			request: MonteCarloRequest;
			records: RunRecord[];
	  };

export type DesignOutcome =
	| { ok: true; value: unknown }
	| { ok: false; error: { error: string; code: string; element?: string; node?: string } };

// A few jobs' networks at most; the oldest is dropped first.
const opened = new Map<string, Variants>();
function variantsFor(key: string, document: unknown): Variants {
	let v = opened.get(key);
	if (!v) {
		v = openVariants(document);
		opened.set(key, v);
		if (opened.size > 4) opened.delete(opened.keys().next().value!);
	}
	return v;
}

function run(task: DesignTask): unknown {
	switch (task.kind) {
		case 'sweep':
			return sweep(task.document, task.request);
		case 'solve':
			return solveForValue(task.document, task.request);
		case 'sensitivity':
			return sensitivity(task.document);
		case 'worst-case':
			return worstCase(task.document, task.request);
		case 'spec': {
			const m = evaluateWith(openVariants(task.document), {}, optionsFor(task.spec));
			return { ...checkSpec(task.spec, m), figures: metricsOf(m) };
		}
		case 'variant-spec':
			// The document has passed the front door's shape check (checkDesignNetwork).
			return judgeVariants(task.document as NetworkDocument, task.spec, task.across);
		case 'mc-chunk': {
			const v = variantsFor(task.key, task.document);
			checkTolerances(v, task.request.tolerances);
			return monteCarloChunk(v, task.request, task.from, task.to);
		}
		case 'large-analysis': {
			const port = task.progress;
			let last = -1;
			const value = analyze(task.document, {
				dominant: { count: task.options.poles, near: task.options.near },
				frequency: task.options.points === 0 ? false : { points: task.options.points ?? 200 },
				onProgress: (done, stage) => {
					// At most one message per percent: the job row records each.
					const pct = Math.floor(done * 100);
					if (pct !== last) port?.postMessage({ done: pct, stage });
					last = pct;
				}
			});
			port?.close();
			return value;
		}
		case 'mc-summary': {
			const result = summarize(variantsFor(task.key, task.document), task.request, task.records);
			opened.delete(task.key);
			return result;
		}
	}
}

export default function handle(task: DesignTask): DesignOutcome {
	try {
		return { ok: true, value: run(task) };
	} catch (error) {
		if (error instanceof SolverError || error instanceof DesignError)
			return { ok: false, error: error.toJSON() };
		if (error instanceof VariantError)
			return { ok: false, error: { error: error.message, code: error.code, ...(error.where.element ? { element: error.where.element } : {}) } };
		throw error;
	}
}

/** A no-op the pool answers once a thread is up (the pools wait for it before starting a task's clock). */
export function ready(): boolean {
	return true;
}
