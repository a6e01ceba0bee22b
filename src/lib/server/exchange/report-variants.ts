// The report's variant part: every variant analysed (one pool task), what each one overrides in
// words, and every variant against the sheet's limits and its specs across variants.
import type { NetworkDocument } from '../../network/schema';
import { hasVariants, listVariants, overridesOf, VariantError } from '../../network/variants';
import type { Analysis } from '../../solver';
import type { VariantSpecOutcome } from '../../design/cross-spec';
import { getDesignSettings } from '../db/design-jobs';
import { runDesign } from '../jobs/design-pool';
import { analyzeVariants } from '../variant-analysis';

export interface ReportVariant {
	name: string;
	/** What the variant changes against the drawing, in words ("Rtop = 9.9M (Range: 100:1)"). */
	overrides: string[];
	analysis: Analysis | null;
	error: { error: string } | null;
}

export async function reportVariants(document: unknown, sheetId?: string) {
	const doc = document as NetworkDocument;
	if (!hasVariants(doc)) return null;
	let list;
	try {
		list = listVariants(doc);
	} catch (e) {
		if (e instanceof VariantError)
			return { list: [] as ReportVariant[], spec: null, error: e.message };
		throw e;
	}
	const outcomes = await analyzeVariants(doc, list, {
		frequency: { points: 300 },
		step: { points: 400 }
	});
	const words = (choice: number[]) => {
		try {
			const o = overridesOf(doc, choice);
			return [
				...[...o.values].map(([id, v]) => `${id} = ${v.value} (${v.option})`),
				...[...o.absent].map((id) => `${id} not in the network`),
				...[...o.present].map((id) => `${id} put in`)
			];
		} catch (e) {
			return [(e as Error).message];
		}
	};
	const rows: ReportVariant[] = list.map((v, i) => ({
		name: v.name,
		overrides: words(v.choice),
		analysis: outcomes[i].analysis as Analysis | null,
		error: outcomes[i].error
	}));
	let spec: VariantSpecOutcome | null = null;
	if (sheetId) {
		const settings = await getDesignSettings(sheetId);
		const judged = await runDesign({
			kind: 'variant-spec',
			document: doc,
			spec: settings.spec,
			across: settings.across ?? []
		}).catch(() => null);
		spec = (judged as VariantSpecOutcome | null) ?? null;
	}
	return { list: rows, spec, error: null as string | null };
}
