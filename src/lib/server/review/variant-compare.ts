// Two revisions of a sheet with variants, variant by variant: what changed in each variant's own
// network (an override changed is a value change there; a part taken out in one position is a
// removal there), how its poles and zeros moved, and its headline figures before and after. A
// variant that exists on one side only is listed as added or removed. Variants are matched by
// name (their option names), so renaming an option reads as one variant removed, one added.
import type { NetworkDocument } from '../../network/schema';
import type { Analysis } from '../../solver';
import {
	hasVariants,
	listVariants,
	resolveVariant,
	type VariantInfo
} from '../../network/variants';
import { analyzeVariants } from '../variant-analysis';
import {
	diffElements,
	figureChanges,
	matchSingularities,
	type ElementDiff,
	type Figure,
	type Movement
} from './compare';

export interface VariantComparison {
	name: string;
	/** 'both', or the side it exists on. */
	on: 'both' | 'from' | 'to';
	error: { from: string | null; to: string | null };
	elements: ElementDiff | null;
	poles: Movement[];
	zeros: Movement[];
	figures: Figure[];
}

const OPTIONS = { frequency: { points: 200 }, step: { points: 400 } };

function variantsOf(doc: NetworkDocument): VariantInfo[] {
	try {
		return hasVariants(doc) ? listVariants(doc) : [];
	} catch {
		return [];
	}
}

/** Null when neither revision has variants (the plain comparison says everything). */
export async function compareVariants(
	a: NetworkDocument,
	b: NetworkDocument
): Promise<VariantComparison[] | null> {
	const [va, vb] = [variantsOf(a), variantsOf(b)];
	if (va.length === 0 && vb.length === 0) return null;
	const [oa, ob] = await Promise.all([
		analyzeVariants(a, va, OPTIONS),
		analyzeVariants(b, vb, OPTIONS)
	]);
	const byName = (list: VariantInfo[], outs: typeof oa) =>
		new Map(list.map((v, i) => [v.name, { info: v, out: outs[i] }]));
	const [ma, mb] = [byName(va, oa), byName(vb, ob)];
	const names = [...new Set([...va.map((v) => v.name), ...vb.map((v) => v.name)])];
	return names.map((name) => {
		const [x, y] = [ma.get(name), mb.get(name)];
		const [xa, ya] = [
			x?.out.analysis as Analysis | null | undefined,
			y?.out.analysis as Analysis | null | undefined
		];
		const both = !!x && !!y;
		let elements: ElementDiff | null = null;
		if (both) {
			try {
				elements = diffElements(
					resolveVariant(a, x.info) as NetworkDocument,
					resolveVariant(b, y.info) as NetworkDocument
				);
			} catch {
				elements = null;
			}
		}
		return {
			name,
			on: both ? 'both' : x ? 'from' : 'to',
			error: { from: x?.out.error?.error ?? null, to: y?.out.error?.error ?? null },
			elements,
			poles: xa && ya ? matchSingularities(xa.poles, ya.poles) : [],
			zeros: xa && ya ? matchSingularities(xa.zeros, ya.zeros) : [],
			figures: figureChanges(xa ?? null, ya ?? null)
		};
	});
}
