import { describe, expect, it } from 'vitest';
import { autoLayout } from './auto-layout';
import { fromDocument, sameNetwork } from './from-document';
import { placedTerminals } from './geometry';
import { computeNets } from './nets';
import { buildDocument } from './to-document';
import type { EditorItem, Snapshot } from './types';
import type { NetworkDocument } from '$lib/network/schema';

const item = (id: string, kind: EditorItem['kind'], name = '', value = ''): EditorItem => ({
	id,
	kind,
	name,
	value,
	x: 0,
	y: 0,
	rotation: 0,
	flip: false
});
const wire = (a: string, ta: string, b: string, tb: string) => ({
	id: `${a}${ta}-${b}${tb}`,
	from: { item: a, terminal: ta },
	to: { item: b, terminal: tb }
});

// The 10:1 divider of the network-format issue (common practice: 9 MΩ ∥ 10 pF over 1 MΩ ∥ 90 pF).
const divider: NetworkDocument = {
	schema: 1,
	elements: [
		{ id: 'Vin', type: 'V', nodes: ['src', 'gnd'], value: 1 },
		{ id: 'Rsrc', type: 'R', nodes: ['src', 'a'], value: '50' },
		{ id: 'Rt', type: 'R', nodes: ['a', 'b'], value: '9M' },
		{ id: 'Ct', type: 'C', nodes: ['a', 'b'], value: '10p' },
		{ id: 'Rin', type: 'R', nodes: ['b', 'gnd'], value: '1M' },
		{ id: 'Cin', type: 'C', nodes: ['b', 'gnd'], value: '90p' }
	],
	input: 'Vin',
	output: { node: 'b', reference: 'gnd' }
};

describe('nets from the drawing', () => {
	it('joins wired terminals, ground marks and equal net names; names the rest n1, n2, …', () => {
		const items = [
			item('r1', 'R', 'R1'),
			item('r2', 'R', 'R2'),
			item('g', 'GND'),
			item('l1', 'LABEL', 'mid'),
			item('l2', 'LABEL', 'mid'),
			item('c', 'C', 'C1')
		];
		const wires = [
			wire('r1', 'b', 'l1', 't'),
			wire('r2', 'a', 'l2', 't'),
			wire('r2', 'b', 'g', 'g')
		];
		const { byTerminal } = computeNets(items, wires);
		expect(byTerminal.get('r1:b')).toBe('mid');
		expect(byTerminal.get('r2:a')).toBe('mid');
		expect(byTerminal.get('r2:b')).toBe('gnd');
		expect(byTerminal.get('r1:a')).toBe('n1');
		expect(byTerminal.get('c:a')).toBe('n2');
		expect(byTerminal.get('c:b')).toBe('n3');
	});

	it('a net named 0 is the reference net (the format treats 0 as gnd)', () => {
		const items = [item('r1', 'R', 'R1'), item('l', 'LABEL', '0')];
		expect(computeNets(items, [wire('r1', 'b', 'l', 't')]).byTerminal.get('r1:b')).toBe('gnd');
	});
});

describe('drawing → document', () => {
	it('an empty sheet is reported, not analysed', () => {
		const b = buildDocument({ title: '', items: [], wires: [], input: null });
		expect(b.document.elements).toEqual([]);
		expect(b.problems.map((p) => p.message).join()).toMatch(/empty/);
	});

	it('a bad value is a problem naming the element; the typed text is kept', () => {
		const s = autoLayout(divider);
		const items = s.items.map((i) => (i.name === 'Ct' ? { ...i, value: '10pp' } : i));
		const b = buildDocument({ ...s, items });
		expect(b.problems).toHaveLength(1);
		expect(b.problems[0].message).toMatch(/^Ct: /);
		expect(b.problems[0].item).toBe(items.find((i) => i.name === 'Ct')!.id);
		expect(b.document.elements.find((e) => e.id === 'Ct')!.value).toBe('10pp');
	});

	it('missing input and output marker are problems', () => {
		const b = buildDocument({
			title: '',
			items: [item('r', 'R', 'R1', '1k')],
			wires: [],
			input: null
		});
		expect(b.problems.map((p) => p.message).join('|')).toMatch(/input source.*\|.*output marker/);
	});
});

describe('document → drawing → document', () => {
	it('the automatic layout draws exactly the network it was given', () => {
		const s = autoLayout(divider);
		const b = buildDocument(s);
		expect(b.problems).toEqual([]);
		expect(sameNetwork(b.document, divider)).toBe(true);
	});

	it('a stored layout is restored when it still draws the document, replaced when not', () => {
		const s = autoLayout(divider);
		const moved: Snapshot = { ...s, items: s.items.map((i) => ({ ...i, x: i.x + 100 })) };
		const { layout, document } = buildDocument(moved);
		expect(fromDocument(document, layout).items[0].x).toBe(moved.items[0].x);
		const edited = {
			...divider,
			elements: divider.elements.map((e) => (e.id === 'Ct' ? { ...e, value: '11p' } : e))
		};
		const redrawn = fromDocument(edited, layout);
		expect(redrawn.items.find((i) => i.name === 'Ct')!.value).toBe('11p');
	});

	it('sameNetwork sees a changed connection', () => {
		const swapped = {
			...divider,
			elements: divider.elements.map((e) => (e.id === 'Cin' ? { ...e, nodes: ['a', 'gnd'] } : e))
		};
		expect(sameNetwork(divider, swapped)).toBe(false);
	});
});

describe('symbol geometry', () => {
	it('rotating a resistor a quarter turn puts its terminals top and bottom', () => {
		const t = placedTerminals({ kind: 'R', rotation: 90, flip: false });
		expect(t.map((p) => [p.name, p.x, p.y, p.side])).toEqual([
			['a', 20, 0, 'top'],
			['b', 20, 80, 'bottom']
		]);
	});
	it('mirroring swaps the ends', () => {
		const t = placedTerminals({ kind: 'R', rotation: 0, flip: true });
		expect(t.map((p) => [p.name, p.side])).toEqual([
			['a', 'right'],
			['b', 'left']
		]);
	});
});

describe('part roles through the drawing', () => {
	const withRoles: NetworkDocument = {
		...divider,
		elements: divider.elements.map((e) =>
			e.id === 'Ct'
				? { ...e, role: 'trimmer' as const, range: { min: '5p', max: '15p' } }
				: e.id === 'Cin'
					? { ...e, role: 'fixed' as const }
					: e
		)
	};
	it('a document with roles opens and saves with the same roles and range', () => {
		const built = buildDocument(fromDocument(withRoles)).document;
		const ct = built.elements.find((e) => e.id === 'Ct')!;
		expect(ct.role).toBe('trimmer');
		expect(ct.range).toEqual({ min: '5p', max: '15p' });
		expect(built.elements.find((e) => e.id === 'Cin')!.role).toBe('fixed');
		expect(built.elements.find((e) => e.id === 'Rt')!.role).toBeUndefined();
	});
	it('a changed role is a changed network (the stored layout is not reused for it)', () => {
		expect(sameNetwork(withRoles, divider)).toBe(false);
	});
	it('a trimmer with a half-typed range is a problem naming the part', () => {
		const s = fromDocument(withRoles);
		const items = s.items.map((i) =>
			i.name === 'Ct' ? { ...i, range: { min: '5pp', max: '15p' } } : i
		);
		const { problems } = buildDocument({ ...s, items });
		expect(problems.map((p) => p.message).join()).toMatch(/^Ct: range min: /);
	});
});
