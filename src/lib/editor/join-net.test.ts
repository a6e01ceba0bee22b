import { describe, expect, it } from 'vitest';
import { EditorState } from './editor-state.svelte';
import { computeNets } from './nets';

function twoResistors() {
	const s = new EditorState();
	const r1 = s.addItem('R', 0, 0)!;
	const r2 = s.addItem('R', 200, 200)!;
	const r3 = s.addItem('R', 400, 0)!;
	s.connect({ item: r1, terminal: 'b' }, { item: r3, terminal: 'a' });
	const netOf = (item: string, terminal: string) =>
		computeNets(s.items, s.wires).byTerminal.get(`${item}:${terminal}`);
	return { s, r1, r2, r3, netOf };
}

describe('joining a terminal to a net by name', () => {
	it('"gnd" places a ground mark wired to the terminal', () => {
		const { s, r2, netOf } = twoResistors();
		const out = s.joinNet({ item: r2, terminal: 'b' }, 'gnd');
		expect(out).toHaveProperty('added');
		expect(s.items.filter((i) => i.kind === 'GND')).toHaveLength(1);
		expect(netOf(r2, 'b')).toBe('gnd');
	});

	it('an unnamed net is joined by a wire to one of its terminals', () => {
		const { s, r1, r2, netOf } = twoResistors();
		const name = netOf(r1, 'b')!;
		expect(name).toMatch(/^n\d+$/);
		const before = s.items.length;
		s.joinNet({ item: r2, terminal: 'a' }, name);
		expect(s.items).toHaveLength(before);
		expect(netOf(r2, 'a')).toBe(netOf(r1, 'b'));
	});

	it('a new name places a net-name mark; a second terminal with that name joins it', () => {
		const { s, r1, r2, netOf } = twoResistors();
		s.joinNet({ item: r1, terminal: 'a' }, 'tip');
		s.joinNet({ item: r2, terminal: 'a' }, 'tip');
		expect(s.items.filter((i) => i.kind === 'LABEL').map((i) => i.name)).toEqual(['tip', 'tip']);
		expect(netOf(r1, 'a')).toBe('tip');
		expect(netOf(r2, 'a')).toBe('tip');
		// One undo step each.
		s.undo();
		expect(netOf(r2, 'a')).not.toBe('tip');
	});

	it('refuses an empty name, spaces, and the net the terminal is already on', () => {
		const { s, r1 } = twoResistors();
		const n = s.items.length;
		expect(s.joinNet({ item: r1, terminal: 'a' }, '  ')).toEqual({
			problem: 'type the name of a net'
		});
		expect(s.joinNet({ item: r1, terminal: 'a' }, 'a b')).toEqual({
			problem: 'a net name cannot contain spaces'
		});
		s.joinNet({ item: r1, terminal: 'a' }, 'tip');
		expect(s.joinNet({ item: r1, terminal: 'a' }, 'tip')).toEqual({
			problem: 'this terminal is already on tip'
		});
		expect(s.items).toHaveLength(n + 1);
	});
});
