// Variants of one sheet, resolved to plain networks. Pure data in, data out, no solver imports:
// the editor resolves the picked variant in the browser without pulling the solver into the
// page's bundle, and the solver's front door uses `baseNetwork` so a document with variants
// analyses as its base everywhere a variant is not asked for.
//
// A variant is one option from each group ("100:1" from Range, "2 m cable" from Cable). Its
// network is the drawing, minus the parts absent in the base (`variants.absent`), with each
// chosen option's values, absent parts and present parts applied. Two options of one variant
// may not disagree about the same part (both set its value, or one puts it in and one takes it
// out): which should win is the designer's decision, so it is an error naming both.
import type { NetworkDocument, NetworkElement } from './schema';
import type { VariantOption, VariantSet } from './variant-schema';
import { VARIANT_JOIN, VARIANT_LIMITS } from './variant-limits';

export interface VariantInfo {
	/** The option names joined with " · " — the variant's name in tables, legends and the API. */
	name: string;
	/** One option name per group, in group order. */
	options: string[];
	/** The chosen option's index in each group. */
	choice: number[];
}

export class VariantError extends Error {
	readonly code = 'bad_variants';
	constructor(
		message: string,
		readonly where: { element?: string; variant?: string } = {}
	) {
		super(message);
		this.name = 'VariantError';
	}
}

type WithVariants = Pick<NetworkDocument, 'elements'> & { variants?: VariantSet | null };

/** True when the document defines at least one variant group. */
export const hasVariants = (doc: WithVariants): boolean => (doc.variants?.groups.length ?? 0) > 0;

function checkReferences(doc: WithVariants): void {
	const v = doc.variants;
	if (!v) return;
	const byId = new Map(doc.elements.map((e) => [e.id, e]));
	const baseAbsent = new Set(v.absent ?? []);
	const known = (id: string, where: string) => {
		if (!byId.has(id))
			throw new VariantError(`${where}: there is no element "${id}" on the sheet`, { element: id });
		return byId.get(id)!;
	};
	for (const id of baseAbsent) known(id, 'variants.absent');
	const groupNames = new Set<string>();
	for (const g of v.groups) {
		if (groupNames.has(g.name)) throw new VariantError(`two variant groups are called "${g.name}"`);
		groupNames.add(g.name);
		const optionNames = new Set<string>();
		for (const o of g.options) {
			const where = `variant option "${g.name}: ${o.name}"`;
			if (optionNames.has(o.name))
				throw new VariantError(`group "${g.name}" has two options called "${o.name}"`);
			optionNames.add(o.name);
			for (const id of Object.keys(o.values ?? {})) {
				if (known(id, where).type === 'OPAMP')
					throw new VariantError(`${where}: "${id}" is an ideal op-amp and has no value`, {
						element: id
					});
			}
			for (const id of o.absent ?? []) known(id, where);
			for (const id of o.present ?? []) {
				known(id, where);
				if (!baseAbsent.has(id))
					throw new VariantError(
						`${where}: "${id}" is present in the base already (only a part absent in the base can be put in)`,
						{ element: id }
					);
			}
			const both = (o.absent ?? []).find((id) => (o.present ?? []).includes(id));
			if (both)
				throw new VariantError(`${where}: "${both}" is listed as both absent and present`, {
					element: both
				});
		}
	}
	const count = v.groups.reduce((n, g) => n * g.options.length, 1);
	if (count > VARIANT_LIMITS.combinations)
		throw new VariantError(
			`the variant groups make ${count} combinations; the limit is ${VARIANT_LIMITS.combinations}`
		);
}

/**
 * Every variant of the document, first group slowest (so the variants of one range position
 * stand together). Checks the variant block's references and throws a VariantError naming the
 * option and the element. A document without groups has no variants: [].
 */
export function listVariants(doc: WithVariants): VariantInfo[] {
	checkReferences(doc);
	const groups = doc.variants?.groups ?? [];
	if (groups.length === 0) return [];
	let combos: number[][] = [[]];
	for (const g of groups) combos = combos.flatMap((c) => g.options.map((_, i) => [...c, i]));
	return combos.map((choice) => {
		const options = choice.map((i, k) => groups[k].options[i].name);
		return { name: options.join(VARIANT_JOIN), options, choice };
	});
}

/** The variant called `name` (options joined with " · "), or a VariantError listing the names. */
export function findVariant(doc: WithVariants, name: string): VariantInfo {
	const all = listVariants(doc);
	const want = name.trim();
	const hit = all.find((v) => v.name === want);
	if (hit) return hit;
	throw new VariantError(
		all.length
			? `there is no variant "${want}"; the sheet has ${all.map((v) => `"${v.name}"`).join(', ')}`
			: `there is no variant "${want}": the sheet has no variants`,
		{ variant: want }
	);
}

/** What one variant does to each part: the value it sets (and which option set it), or absence. */
export interface Overrides {
	values: Map<string, { value: number | string; option: string; group: number }>;
	absent: Set<string>;
	/** Parts this variant's options put in although the base leaves them out. */
	present: Set<string>;
}

export function overridesOf(doc: WithVariants, choice: number[]): Overrides {
	const v = doc.variants;
	const out: Overrides = {
		values: new Map(),
		absent: new Set(v?.absent ?? []),
		present: new Set()
	};
	if (!v) return out;
	const said = new Map<string, { present: boolean; option: string }>();
	v.groups.forEach((g, k) => {
		const o: VariantOption | undefined = g.options[choice[k]];
		if (!o) throw new VariantError(`group "${g.name}" has no option number ${choice[k] + 1}`);
		const label = `${g.name}: ${o.name}`;
		for (const [id, value] of Object.entries(o.values ?? {})) {
			const earlier = out.values.get(id);
			if (earlier)
				throw new VariantError(
					`"${earlier.option}" and "${label}" both set the value of ${id}; set it in one group only`,
					{ element: id }
				);
			out.values.set(id, { value, option: label, group: k });
		}
		const mark = (id: string, present: boolean) => {
			const earlier = said.get(id);
			if (earlier && earlier.present !== present)
				throw new VariantError(
					`"${earlier.option}" and "${label}" disagree whether ${id} is in the network`,
					{ element: id }
				);
			said.set(id, { present, option: label });
		};
		for (const id of o.absent ?? []) mark(id, false);
		for (const id of o.present ?? []) mark(id, true);
	});
	for (const [id, s] of said) {
		if (s.present) {
			out.absent.delete(id);
			out.present.add(id);
		} else out.absent.add(id);
	}
	// In the drawing's order of parts: stored JSON (PostgreSQL's jsonb) does not keep key order.
	const order = new Map(doc.elements.map((e, i) => [e.id, i]));
	const byDrawing = (a: string, b: string) => (order.get(a) ?? 0) - (order.get(b) ?? 0);
	out.values = new Map([...out.values].sort(([a], [b]) => byDrawing(a, b)));
	out.absent = new Set([...out.absent].sort(byDrawing));
	out.present = new Set([...out.present].sort(byDrawing));
	return out;
}

/**
 * The plain network of one variant: no `variants` key, absent parts left out, overridden values
 * in place. Every other field of the document and of each element (net names, roles, anything
 * added later) passes through unchanged.
 */
export function resolveVariant<D extends WithVariants>(
	doc: D,
	variant: VariantInfo | string
): Omit<D, 'variants'> {
	const info = typeof variant === 'string' ? findVariant(doc, variant) : variant;
	checkReferences(doc);
	return apply(doc, overridesOf(doc, info.choice));
}

/** The base network: the drawing minus the parts absent in the base; no overrides. */
export function baseNetwork<D extends WithVariants>(doc: D): Omit<D, 'variants'> {
	if (!doc.variants) return doc;
	return apply(doc, {
		values: new Map(),
		absent: new Set(doc.variants.absent ?? []),
		present: new Set()
	});
}

function apply<D extends WithVariants>(doc: D, o: Overrides): Omit<D, 'variants'> {
	// eslint-disable-next-line @typescript-eslint/no-unused-vars
	const { variants, ...rest } = doc;
	const elements: NetworkElement[] = [];
	for (const e of doc.elements) {
		if (o.absent.has(e.id)) continue;
		const set = o.values.get(e.id);
		elements.push(set ? { ...e, value: set.value } : e);
	}
	return { ...rest, elements } as Omit<D, 'variants'>;
}
