// Spec limits on a sheet with variants: every limit applies to every variant (pass/fail per
// variant), and the cross-variant specs (cross-spec.ts) compare the variants with each other.
// The figures are the design aids' exact ones (input capacitance from the pole–residue form at
// the stated frequency, not read off a sampled curve).
import type { NetworkDocument } from '../network/schema';
import { listVariants, resolveVariant, type VariantInfo } from '../network/variants';
import type { CrossSpec, SpecLimits } from '../network/design-schema';
import { SolverError } from '../solver/errors';
import { evaluateWith, openVariants } from './variants';
import { metricsOf } from './evaluate';
import { checkSpec, DEFAULT_CAPACITANCE_AT, optionsFor } from './spec-limits';
import { checkAcross, type VariantJudged, type VariantSpecOutcome } from './cross-spec';

export * from './cross-spec';

/** Evaluate every variant of the document and judge the limits and the cross-variant specs. */
export function judgeVariants(
	doc: NetworkDocument,
	spec: SpecLimits,
	across: CrossSpec[]
): VariantSpecOutcome {
	const list: VariantInfo[] = listVariants(doc);
	const needsInput = across.some(
		(c) => c.figure === 'inputCapacitance' || c.figure === 'inputResistance'
	);
	const at = spec.inputCapacitanceAt ?? DEFAULT_CAPACITANCE_AT;
	const opts = { ...optionsFor(spec), ...(needsInput ? { inputAt: at } : {}) };
	const variants: VariantJudged[] = list.map((v) => {
		try {
			const m = metricsOf(evaluateWith(openVariants(resolveVariant(doc, v)), {}, opts));
			return {
				name: v.name,
				options: v.options,
				figures: m,
				spec: checkSpec(spec, m),
				error: null
			};
		} catch (e) {
			if (e instanceof SolverError || (e as Error).name === 'VariantError')
				return {
					name: v.name,
					options: v.options,
					figures: null,
					spec: null,
					error: (e as Error).message
				};
			throw e;
		}
	});
	const acrossOut = checkAcross(doc.variants?.groups ?? [], variants, across, at);
	const pass = variants.every((v) => v.spec?.pass ?? false) && acrossOut.every((c) => c.pass);
	return { variants, across: acrossOut, pass };
}
