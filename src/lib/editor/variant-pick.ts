// Which variant the editor shows: the option picked in each group (clamped to the options that
// exist), that variant's name, and what it overrides — for the canvas marks, the override list
// and the result panels. Resolved with the pure variants module: no solver code in the page.
import type { NetworkDocument } from '$lib/network/schema';
import { VARIANT_JOIN } from '$lib/network/variant-limits';
import { listVariants, overridesOf, type Overrides, type VariantInfo } from '$lib/network/variants';

export interface ActiveVariant {
	/** Every variant of the drawing, in the API's order. */
	list: VariantInfo[];
	/** The picked one. */
	info: VariantInfo;
	overrides: Overrides;
	/** Why the variant block or this variant cannot be resolved (two options disagree…), or null. */
	problem: string | null;
}

export function activeVariant(doc: NetworkDocument, pick: number[]): ActiveVariant | null {
	const groups = doc.variants?.groups ?? [];
	if (groups.length === 0) {
		// A file may leave parts out of the base without any group: the canvas still marks them.
		const absent = doc.variants?.absent ?? [];
		if (!absent.length) return null;
		return {
			list: [],
			info: { name: 'the base network', options: [], choice: [] },
			overrides: { values: new Map(), absent: new Set(absent), present: new Set() },
			problem: null
		};
	}
	const choice = groups.map((g, i) => Math.max(0, Math.min(pick[i] ?? 0, g.options.length - 1)));
	const options = choice.map((c, i) => groups[i].options[c].name);
	const info: VariantInfo = { name: options.join(VARIANT_JOIN), options, choice };
	const empty: Overrides = { values: new Map(), absent: new Set(), present: new Set() };
	let list: VariantInfo[] = [];
	try {
		list = listVariants(doc);
		return { list, info, overrides: overridesOf(doc, choice), problem: null };
	} catch (e) {
		return { list, info, overrides: empty, problem: (e as Error).message };
	}
}
