import { describe, expect, it } from 'vitest';
import { EditorState } from './editor-state.svelte';
import { describeItem, describeTerminal, describeWire, type DescribeContext } from './describe';
import { computeNets } from './nets';

/** Source, a series resistor to a net named "tip", a shunt capacitor, ground marks. */
function sheet() {
	const s = new EditorState();
	const v = s.addItem('V', 0, 0)!;
	const r = s.addItem('R', 200, 0)!;
	const c = s.addItem('C', 400, 0)!;
	const g1 = s.addItem('GND', 0, 200)!;
	const g2 = s.addItem('GND', 400, 200)!;
	const tip = s.addItem('LABEL', 300, -100)!;
	s.rename(tip, 'tip');
	s.setValues({ R1: '9M' });
	s.connect({ item: v, terminal: 'p' }, { item: r, terminal: 'a' });
	s.connect({ item: r, terminal: 'b' }, { item: tip, terminal: 't' });
	s.connect({ item: r, terminal: 'b' }, { item: c, terminal: 'a' });
	s.connect({ item: v, terminal: 'n' }, { item: g1, terminal: 'g' });
	s.connect({ item: c, terminal: 'b' }, { item: g2, terminal: 'g' });
	const ctx = (): DescribeContext => ({
		items: s.items,
		wires: s.wires,
		nets: computeNets(s.items, s.wires),
		input: s.input
	});
	const item = (id: string) => s.items.find((i) => i.id === id)!;
	return { s, v, r, c, g1, g2, tip, ctx, item };
}

describe('canvas words', () => {
	it('names a part by designator, value and the nets it sits between', () => {
		const { ctx, item, r, c, v } = sheet();
		expect(describeItem(ctx(), item(r), '9 MΩ')).toBe('R1, resistor 9 MΩ, between n1 and tip');
		expect(describeItem(ctx(), item(c))).toBe('C1, capacitor 10p, between tip and gnd');
		expect(describeItem(ctx(), item(v))).toMatch(
			/^V1, voltage source .*, the input, between n1 and gnd$/
		);
	});

	it('says which end is open, and when a part is not wired at all', () => {
		const { s, ctx, item } = sheet();
		const r2 = s.addItem('R', 600, 0)!;
		expect(describeItem(ctx(), item(r2))).toBe('R2, resistor 1k, not wired');
		const c1 = s.items.find((i) => i.name === 'C1')!;
		s.connect({ item: r2, terminal: 'a' }, { item: c1.id, terminal: 'a' });
		expect(describeItem(ctx(), item(r2))).toBe(
			'R2, resistor 1k, terminal 1 on tip, terminal 2 open'
		);
	});

	it('tells the ground marks apart by what they are wired to', () => {
		const { ctx, item, g1, g2, tip } = sheet();
		expect(describeItem(ctx(), item(g1))).toBe('Ground mark, wired to V1');
		expect(describeItem(ctx(), item(g2))).toBe('Ground mark, wired to C1');
		expect(describeItem(ctx(), item(tip))).toBe('Net name tip, wired to R1');
	});

	it('describes terminals and wires by net and ends, not internal ids', () => {
		const { s, ctx, item, r } = sheet();
		expect(describeTerminal(ctx(), item(r), 'b')).toBe('R1 terminal 2, on tip with C1');
		const w = s.wires.find((x) => x.from.item === r && x.from.terminal === 'b')!;
		expect(describeWire(ctx(), w)).toBe('Wire on tip, R1 terminal 2 to net name tip net terminal');
		const r2 = s.addItem('R', 600, 0)!;
		expect(describeTerminal(ctx(), item(r2), 'a')).toBe('R2 terminal 1, open');
	});
});
