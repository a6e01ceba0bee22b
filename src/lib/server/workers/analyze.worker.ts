// One analysis per call, inside a worker thread so a large network never blocks the server.
// Errors come back as plain data: class instances do not survive the trip between threads.
import { analyze, SolverError } from '../../solver';
import type { AnalyzeOptions } from '../../solver';
import {
	twoPort,
	TwoPortError,
	type TwoPortRequest,
	type TwoPortResult
} from '../../exchange/two-port';
import { yieldToServerThread } from './thread-priority';
import { trimAnalysis, type Omittable } from '../analysis-omit';

// Pages and saves first: this thread computes at a lower priority than the server's.
yieldToServerThread();

export interface AnalyzeTask {
	document: unknown;
	options?: AnalyzeOptions;
	/** Answer the analysis as JSON text, trimmed so (POST /api/analyze): building and copying
	 * the answer then happens here, not on the thread that serves every other request. */
	asJson?: { omit: Omittable[]; matrixPorts: number | null };
}

export type AnalyzeOutcome =
	| { ok: true; analysis: unknown; json?: undefined }
	| { ok: true; json: string; analysis?: undefined }
	| { ok: false; error: { error: string; code: string; element?: string; node?: string } };

export default function run({ document, options, asJson }: AnalyzeTask): AnalyzeOutcome {
	try {
		const analysis = analyze(document, options);
		if (asJson) {
			const trimmed = trimAnalysis(analysis, {
				omit: new Set(asJson.omit),
				matrixPorts: asJson.matrixPorts
			});
			return { ok: true, json: JSON.stringify(trimmed) };
		}
		return { ok: true, analysis };
	} catch (error) {
		if (error instanceof SolverError) return { ok: false, error: error.toJSON() };
		throw error;
	}
}

/**
 * Several networks in one task (the variants of one sheet): one trip through the queue instead
 * of one per variant, so a sheet with many variants cannot fill the queue on its own. Each
 * network keeps its own outcome: one refused variant does not stop the others.
 */
export function runMany({
	documents,
	options
}: {
	documents: unknown[];
	options?: AnalyzeOptions;
}): AnalyzeOutcome[] {
	return documents.map((document) => run({ document, options }));
}

export type TwoPortOutcome =
	| { ok: true; result: TwoPortResult }
	| { ok: false; error: { message: string; details: TwoPortError['details'] } };

/** Two-port parameters over frequency (the Touchstone export): the same threads and limits as
 * an analysis, because it is the same kind of work (one complex solve per frequency). */
export function twoPortTask(request: TwoPortRequest): TwoPortOutcome {
	try {
		return { ok: true, result: twoPort(request) };
	} catch (error) {
		if (error instanceof TwoPortError)
			return { ok: false, error: { message: error.message, details: error.details } };
		throw error;
	}
}

/** A no-op the pool answers once a thread is up (the pools wait for it before starting a task's clock). */
export function ready(): boolean {
	return true;
}
