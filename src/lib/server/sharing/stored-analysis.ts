// The analysis of a stored revision, for the API and read-only links. Revisions are immutable,
// so the same revision always gives the same result; a network the solver refuses is 422 with
// the solver's code and the element or node at fault. The solver runs in the worker pool.
import { json } from '@sveltejs/kit';
import { problem } from '../api/respond';
import { analyzeInPool } from '../jobs/analysis-pool';
import type { Actor } from '../access';
import { readRevision } from './sheet-actions';
import { INTERACTIVE_ELEMENT_LIMIT } from '../../network/limits';

// Stored documents may hold up to ELEMENT_LIMIT elements; analysis in a request is held to the
// interactive size (network/limits.ts) so one call cannot hold the server for long; larger
// revisions are analyzed as background jobs (POST /api/analyze/jobs).
export const ANALYSIS_ELEMENT_LIMIT = INTERACTIVE_ELEMENT_LIMIT;

export async function analysisResponse(actor: Actor, sheetId: string, number?: number): Promise<Response> {
	const { revision } = await readRevision(actor, sheetId, number, 'analyze');
	const count = (revision.document as { elements?: unknown[] }).elements?.length ?? 0;
	if (count > ANALYSIS_ELEMENT_LIMIT) {
		return problem(422, `Revision ${revision.number} has ${count} elements; analysis here is limited to ${ANALYSIS_ELEMENT_LIMIT}; queue it with POST /api/analyze/jobs.`, { code: 'too_large' });
	}
	// In the worker pool like POST /api/analyze: a large stored network never blocks the server.
	const outcome = await analyzeInPool({ document: revision.document });
	if (!outcome.ok) {
		const { error, ...where } = outcome.error;
		return problem(422, error, { ...where, revision: revision.number });
	}
	return json({ sheetId, revision: revision.number, analysis: outcome.analysis }, { headers: { 'cache-control': 'private, max-age=300' } });
}
