// One analysis per call, inside a worker thread so a large network never blocks the server.
// Errors come back as plain data: class instances do not survive the trip between threads.
import { analyze, SolverError } from '../../solver';
import type { AnalyzeOptions } from '../../solver';

export interface AnalyzeTask {
	document: unknown;
	options?: AnalyzeOptions;
}

export type AnalyzeOutcome =
	| { ok: true; analysis: unknown }
	| { ok: false; error: { error: string; code: string; element?: string; node?: string } };

export default function run({ document, options }: AnalyzeTask): AnalyzeOutcome {
	try {
		return { ok: true, analysis: analyze(document, options) };
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
