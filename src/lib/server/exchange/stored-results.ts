// The analysis of a stored revision for exports (CSV tables, the report), run in the worker
// pool so a large sheet never blocks the server; a network the solver refuses is 422 with the
// solver's own message and the element or node at fault.
import type { Analysis, AnalyzeOptions } from '../../solver';
import type { Actor } from '../access';
import { ApiProblem } from '../api/respond';
import { analyzeInPool } from '../jobs/analysis-pool';
import { requireInteractive } from '../analysis-limits';
import { readRevision } from '../sharing/sheet-actions';

export async function revisionAnalysis(
	document: unknown,
	revision: number,
	options?: AnalyzeOptions
): Promise<Analysis> {
	requireInteractive(document, `revision ${revision}`);
	const outcome = await analyzeInPool({ document, options });
	if (!outcome.ok) throw new ApiProblem(422, outcome.error.error, { ...outcome.error, revision });
	return outcome.analysis as Analysis;
}

/** `?revision=n` (default: the latest) → that revision, checked for `action`. */
export async function revisionFromQuery(
	actor: Actor,
	sheetId: string,
	url: URL,
	action: 'read' | 'analyze' = 'read'
) {
	const raw = url.searchParams.get('revision');
	if (raw !== null && !/^[1-9]\d{0,8}$/.test(raw))
		throw new ApiProblem(400, 'revision must be a revision number (1, 2, …)');
	return readRevision(actor, sheetId, raw === null ? undefined : Number(raw), action);
}
