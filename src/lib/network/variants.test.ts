import { describe, expect, it } from 'vitest';
import { networkDocumentSchema, type NetworkDocument } from './schema';
import type { VariantSet } from './variant-schema';
import { baseNetwork, findVariant, listVariants, overridesOf, resolveVariant } from './variants';
import { analyze, SolverError, validateNetwork } from '../solver';

// A small range switch with a cable: parts a position puts in, parts it takes out, values it sets.
type Doc = NetworkDocument & { variants: VariantSet };
const doc = {
	schema: 1 as const,
	title: 'switch',
	elements: [
		{ id: 'V1', type: 'V' as const, nodes: ['in', 'gnd'], value: 1 },
		{ id: 'Rtop', type: 'R' as const, nodes: ['in', 'out'], value: '9M' },
		{ id: 'Rsh', type: 'R' as const, nodes: ['out', 'gnd'], value: '111.1k' },
		{ id: 'Rload', type: 'R' as const, nodes: ['out', 'gnd'], value: '1M', role: 'design' },
		{ id: 'Ccable', type: 'C' as const, nodes: ['out', 'gnd'], value: '42p' }
	],
	input: 'V1',
	output: { node: 'out' },
	variants: {
		absent: ['Rsh'],
		groups: [
			{
				name: 'Range',
				options: [
					{ name: '10:1' },
					{ name: '100:1', values: { Rtop: '9.9M' }, present: ['Rsh'] },
					{ name: '1000:1', values: { Rtop: '9.99M', Rsh: '10.1k' }, present: ['Rsh'] }
				]
			},
			{ name: 'Cable', options: [{ name: '1.2 m' }, { name: '2 m', values: { Ccable: '70p' } }] }
		]
	}
} as Doc;

describe('variants: listing and resolving', () => {
	it('passes the shape check and lists every combination, first group slowest', () => {
		expect(networkDocumentSchema.safeParse(doc).success).toBe(true);
		expect(listVariants(doc).map((v) => v.name)).toEqual([
			'10:1 · 1.2 m',
			'10:1 · 2 m',
			'100:1 · 1.2 m',
			'100:1 · 2 m',
			'1000:1 · 1.2 m',
			'1000:1 · 2 m'
		]);
	});

	it('a document without variants has none, and its base is itself', () => {
		const plain = { ...doc, variants: undefined };
		expect(listVariants(plain)).toEqual([]);
		expect(baseNetwork(plain)).toBe(plain);
	});

	it('resolves values, absent and present parts; other fields pass through unchanged', () => {
		const r = resolveVariant(doc, '1000:1 · 2 m');
		expect(r).not.toHaveProperty('variants');
		expect(r.title).toBe('switch');
		const byId = Object.fromEntries(r.elements.map((e) => [e.id, e]));
		expect(byId.Rtop.value).toBe('9.99M');
		expect(byId.Rsh.value).toBe('10.1k');
		expect(byId.Ccable.value).toBe('70p');
		expect(byId.Rload).toBe(doc.elements[3]); // the role field and all else kept
		const base = resolveVariant(doc, '10:1 · 1.2 m');
		expect(base.elements.map((e) => e.id)).toEqual(['V1', 'Rtop', 'Rload', 'Ccable']);
		expect(baseNetwork(doc)).toEqual(base);
	});

	it('the solver analyses a document with variants as its base network', () => {
		// Closed form (voltage divider, common practice): 1M / (9M + 1M) = 0.1.
		expect(analyze(doc).dcGain).toBeCloseTo(0.1, 12);
		// 100:1: Rsh ∥ Rload = 111.1k ∥ 1M; gain = that / (9.9M + that).
		const sh = 1 / (1 / 111.1e3 + 1 / 1e6);
		expect(analyze(resolveVariant(doc, '100:1 · 1.2 m')).dcGain).toBeCloseTo(sh / (9.9e6 + sh), 12);
	});

	it('names an unknown variant and lists the real ones', () => {
		expect(() => findVariant(doc, '5:1 · 2 m')).toThrow(/no variant "5:1 · 2 m".*"10:1 · 1.2 m"/);
	});

	it('refuses references to parts that are not on the sheet, naming the option', () => {
		const bad = structuredClone(doc);
		bad.variants.groups[1].options[1].values = { Cx: '1p' };
		expect(() => listVariants(bad)).toThrow(
			'variant option "Cable: 2 m": there is no element "Cx"'
		);
		expect(() => validateNetwork(bad)).toThrow(SolverError);
		try {
			validateNetwork(bad);
		} catch (e) {
			expect((e as SolverError).code).toBe('bad_variants');
			expect((e as SolverError).element).toBe('Cx');
		}
	});

	it('refuses putting in a part that is present already, and a part both in and out', () => {
		const a = structuredClone(doc);
		a.variants.groups[0].options[1].present = ['Rtop'];
		expect(() => listVariants(a)).toThrow(/"Rtop" is present in the base already/);
		const b = structuredClone(doc);
		b.variants.groups[0].options[1].absent = ['Rsh'];
		expect(() => listVariants(b)).toThrow(/"Rsh" is listed as both absent and present/);
	});

	it('two groups setting the same value is an error naming both options', () => {
		const c = structuredClone(doc);
		c.variants.groups[1].options[1].values = { Rtop: '8M' };
		expect(() => resolveVariant(c, '100:1 · 2 m')).toThrow(
			'"Range: 100:1" and "Cable: 2 m" both set the value of Rtop; set it in one group only'
		);
		// Combinations where only one of them sets it are fine.
		expect(resolveVariant(c, '10:1 · 2 m').elements.find((e) => e.id === 'Rtop')?.value).toBe('8M');
	});

	it('two groups disagreeing about a part being in the network is an error', () => {
		const c = structuredClone(doc);
		c.variants.groups[1].options[1].absent = ['Rsh'];
		expect(() => overridesOf(c, [1, 1])).toThrow(/disagree whether Rsh is in the network/);
	});

	it('the shape check refuses the joining dot in names, duplicate names and too many combinations', () => {
		const d = structuredClone(doc);
		d.variants.groups[0].options[0].name = 'a · b';
		expect(networkDocumentSchema.safeParse(d).success).toBe(false);
		const e = structuredClone(doc);
		e.variants.groups[0].options[2].name = '10:1';
		expect(() => listVariants(e)).toThrow('group "Range" has two options called "10:1"');
		const many = structuredClone(doc);
		const opts = Array.from({ length: 7 }, (_, i) => ({ name: `o${i}` }));
		many.variants.groups = [
			{ name: 'A', options: opts },
			{ name: 'B', options: opts }
		];
		expect(() => listVariants(many)).toThrow(
			'the variant groups make 49 combinations; the limit is 36'
		);
	});
});
