// Analysing a sheet's variants on the server: which variant a request asks for (`?variant=NAME`,
// `?variants=all`, or neither: the base network), resolving them, and running them as one task
// in the analysis pool. Each variant keeps its own outcome, so one refused variant (an option
// that took out the input source) does not hide the others.
import type { AnalyzeOptions } from '../solver';
import type { NetworkDocument } from '../network/schema';
import {
	findVariant,
	listVariants,
	resolveVariant,
	VariantError,
	type VariantInfo
} from '../network/variants';
import { ApiProblem } from './api/respond';
import { analyzeManyInPool } from './jobs/analysis-pool';
import type { AnalyzeOutcome } from './workers/analyze.worker';

export type VariantChoice = { kind: 'base' } | { kind: 'one'; name: string } | { kind: 'all' };

export interface VariantOutcome {
	name: string;
	options: string[];
	analysis: unknown | null;
	error: { error: string; code: string; element?: string; node?: string } | null;
}

/** `?variant=100:1 · 2 m cable` (one, by name) or `?variants=all`; neither is the base network. */
export function readVariantChoice(url: URL): VariantChoice {
	const one = url.searchParams.get('variant');
	const all = url.searchParams.get('variants');
	if (all !== null && all !== 'all')
		throw new ApiProblem(400, 'variants takes only "all"; name one variant with variant=NAME', {
			code: 'bad_options'
		});
	if (all !== null && one !== null)
		throw new ApiProblem(
			400,
			'ask for one variant (variant=NAME) or all of them (variants=all), not both',
			{
				code: 'bad_options'
			}
		);
	if (all !== null) return { kind: 'all' };
	if (one !== null) return { kind: 'one', name: one };
	return { kind: 'base' };
}

/** The variants a choice asks for (400/422 with the reason when it names none). */
export function variantsFor(document: NetworkDocument, choice: VariantChoice): VariantInfo[] {
	try {
		if (choice.kind === 'one') return [findVariant(document, choice.name)];
		const all = listVariants(document);
		if (choice.kind === 'all' && all.length === 0)
			throw new ApiProblem(400, 'the network has no variants; leave out variants=all', {
				code: 'no_variants'
			});
		return all;
	} catch (e) {
		if (e instanceof VariantError)
			throw new ApiProblem(422, e.message, { code: e.code, ...e.where });
		throw e;
	}
}

/** Resolve one variant; a contradiction between its options is its own error, not a throw. */
function resolved(
	document: NetworkDocument,
	v: VariantInfo
): { doc: unknown } | { error: VariantOutcome['error'] } {
	try {
		return { doc: resolveVariant(document, v) };
	} catch (e) {
		if (e instanceof VariantError)
			return {
				error: {
					error: e.message,
					code: e.code,
					...(e.where.element ? { element: e.where.element } : {})
				}
			};
		throw e;
	}
}

/** Analyse the given variants as one pool task; the outcome of each, in order. */
export async function analyzeVariants(
	document: NetworkDocument,
	variants: VariantInfo[],
	options?: AnalyzeOptions
): Promise<VariantOutcome[]> {
	const docs = variants.map((v) => resolved(document, v));
	const runnable = docs.flatMap((d) => ('doc' in d ? [d.doc] : []));
	const outcomes: AnalyzeOutcome[] = runnable.length
		? await analyzeManyInPool({ documents: runnable, options })
		: [];
	let k = 0;
	return variants.map((v, i) => {
		const d = docs[i];
		const base = { name: v.name, options: v.options };
		if ('error' in d) return { ...base, analysis: null, error: d.error };
		const o = outcomes[k++];
		return o.ok
			? { ...base, analysis: o.analysis, error: null }
			: { ...base, analysis: null, error: o.error };
	});
}
