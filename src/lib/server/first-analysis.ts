// The sheet page's first analysis, computed while the page is rendered: the results are in the
// HTML the browser receives, visible before any JavaScript has loaded (docs/performance.md,
// "Sheet page weight and cold load"). It is the analysis the editor would ask for on opening —
// the same document built from the same drawing, the same options — so the editor takes it as
// its own answer and sends nothing until the first edit (a sheet with variants: all of them, as
// the editor asks). Anything unusual (a drawing with a problem, a large or slow network, a
// solver error) is left to the editor: null. So is a busy server: the page never waits in line
// behind other people's analyses (a sheet page must answer fast under load, docs/performance.md).
import { fromDocument } from '$lib/editor/from-document';
import { buildDocument } from '$lib/editor/to-document';
import { ANALYZE_URL } from '$lib/editor/live-analysis.svelte';
import type { NetworkDocument } from '$lib/network/schema';
import type { FirstAnalysis, VariantResult } from '$lib/editor/live-analysis.svelte';
import type { Analysis } from '$lib/solver';
import { readOptions } from './analysis-request';
import { readTrim, skipped, trimAnalysis } from './analysis-omit';
import { analysisAdmission, analyzeInPool } from './jobs/analysis-pool';
import { analyzeVariants, variantsFor } from './variant-analysis';

/** Larger networks answer later than a page should wait; the editor asks for them itself. */
const MAX_ELEMENTS = 200;
const WAIT_MS = 2000;

export type { FirstAnalysis };

const late = (ms: number) => new Promise<null>((done) => setTimeout(() => done(null), ms));

export async function firstAnalysis(
	document: unknown,
	layout: unknown
): Promise<FirstAnalysis | null> {
	try {
		const built = buildDocument(fromDocument(document as NetworkDocument, layout));
		const doc = built.document;
		if (built.problems.length || doc.elements.length > MAX_ELEMENTS) return null;
		if (!analysisAdmission.hasFreeSlot()) return null;
		const url = new URL(ANALYZE_URL, 'http://polewise.local');
		const trim = readTrim(url);
		const options = { ...readOptions(url), ...skipped(trim) };
		const body = JSON.stringify(doc);
		if ((doc.variants?.groups.length ?? 0) > 0) {
			const outcomes = await Promise.race([
				analyzeVariants(doc, variantsFor(doc, { kind: 'all' }), options),
				late(WAIT_MS)
			]);
			if (!outcomes) return null;
			const variants = outcomes.map((o) => ({
				...o,
				analysis: o.analysis ? trimAnalysis(o.analysis as Analysis, trim) : null
			})) as VariantResult[];
			return { body, analysis: { variants } };
		}
		const outcome = await analyzeInPool({ document: doc, options }, WAIT_MS);
		if (!outcome.ok) return null;
		return { body, analysis: trimAnalysis(outcome.analysis as Analysis, trim) };
	} catch {
		return null;
	}
}
