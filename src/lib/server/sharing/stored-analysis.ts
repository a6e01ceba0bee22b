// The analysis of a stored revision, for the API and read-only links. Revisions are immutable,
// so the same revision always gives the same result; a network the solver refuses is 422 with
// the solver's code and the element or node at fault. The solver runs in the worker pool.
import { json } from '@sveltejs/kit';
import { problem } from '../api/respond';
import { analyzeInPool } from '../jobs/analysis-pool';
import { requireInteractive } from '../analysis-limits';
import type { Actor } from '../access';
import { readRevision } from './sheet-actions';
import { analyzeVariants, variantsFor, type VariantChoice } from '../variant-analysis';
import type { NetworkDocument } from '../../network/schema';

export async function analysisResponse(
	actor: Actor,
	sheetId: string,
	number?: number,
	choice: VariantChoice = { kind: 'base' }
): Promise<Response> {
	const { revision } = await readRevision(actor, sheetId, number, 'analyze');
	// Stored documents may hold more than a request may analyse: the same limits as
	// POST /api/analyze (analysis-limits.ts), 413 with the limit, before anything is queued.
	requireInteractive(revision.document, `revision ${revision.number}`);
	const headers = { 'cache-control': 'private, max-age=300' };
	if (choice.kind !== 'base') {
		// A sheet with variants: one (variant=NAME) or all (variants=all), as POST /api/analyze.
		const doc = revision.document as NetworkDocument;
		const outcomes = await analyzeVariants(doc, variantsFor(doc, choice));
		if (choice.kind === 'all')
			return json({ sheetId, revision: revision.number, variants: outcomes }, { headers });
		const [one] = outcomes;
		if (one.error) {
			const { error, ...where } = one.error;
			return problem(422, `variant "${one.name}": ${error}`, {
				...where,
				variant: one.name,
				revision: revision.number
			});
		}
		return json(
			{ sheetId, revision: revision.number, variant: one.name, analysis: one.analysis },
			{ headers }
		);
	}
	// In the worker pool like POST /api/analyze: a large stored network never blocks the server.
	const outcome = await analyzeInPool({ document: revision.document });
	if (!outcome.ok) {
		const { error, ...where } = outcome.error;
		return problem(422, error, { ...where, revision: revision.number });
	}
	return json({ sheetId, revision: revision.number, analysis: outcome.analysis }, { headers });
}
