// Joining a terminal to a net by typing the net's name (the keyboard's way of wiring to a far
// node): "gnd" or "0" places a ground mark at the terminal; the name of a net that has no name
// mark (n1, n2, …) wires the terminal to one of that net's terminals; any other name places a
// net-name mark carrying it, which joins every terminal with that name.
import { snap, terminalPosition, placedTerminals } from './geometry';
import { computeNets } from './nets';
import { terminalKey, type EditorItem, type TerminalRef, type Wire } from './types';

export type JoinPlan =
	| { ok: true; items: EditorItem[]; wires: Wire[]; how: 'ground' | 'wire' | 'name' }
	| { ok: false; problem: string };

export function planJoin(
	items: EditorItem[],
	wires: Wire[],
	at: TerminalRef,
	typed: string,
	makeId: (prefix: string) => string
): JoinPlan {
	const name = typed.trim();
	if (!name) return { ok: false, problem: 'type the name of a net' };
	if (/\s/.test(name)) return { ok: false, problem: 'a net name cannot contain spaces' };
	if (name.length > 64) return { ok: false, problem: 'the name is longer than 64 characters' };
	const item = items.find((i) => i.id === at.item);
	if (!item) return { ok: false, problem: 'that part is no longer on the sheet' };
	const side = placedTerminals(item).find((t) => t.name === at.terminal)?.side ?? 'right';
	const p = terminalPosition(item, at.terminal);
	const wire = (to: TerminalRef): Wire => ({ id: makeId('w'), from: at, to });

	if (name === 'gnd' || name === '0') {
		const g: EditorItem = {
			id: makeId('it'),
			kind: 'GND',
			name: '',
			value: '',
			// The mark's terminal is its top centre; hang it one grid row below the terminal.
			x: snap(p.x - 20),
			y: snap(p.y + (side === 'top' ? -80 : 40)),
			rotation: side === 'top' ? 180 : 0,
			flip: false
		};
		return { ok: true, items: [g], wires: [wire({ item: g.id, terminal: 'g' })], how: 'ground' };
	}

	const nets = computeNets(items, wires);
	const net = nets.nets.find((n) => n.name === name);
	const named = items.some((i) => i.kind === 'LABEL' && i.name.trim() === name);
	const mine = nets.byTerminal.get(terminalKey(at));
	if (mine === name) return { ok: false, problem: `this terminal is already on ${name}` };
	if (net && !named) {
		// An unnamed net: wire to one of its terminals (a part's rather than a mark's).
		const keys = net.terminals.filter((k) => !k.startsWith(`${at.item}:`));
		const byId = new Map(items.map((i) => [i.id, i]));
		const key =
			keys.find((k) => {
				const it = byId.get(k.slice(0, k.indexOf(':')));
				return it && it.kind !== 'GND' && it.kind !== 'LABEL' && it.kind !== 'PROBE';
			}) ?? keys[0];
		if (!key) return { ok: false, problem: `${name} has no other terminal to wire to` };
		const [toItem, toTerminal] = key.split(':');
		return {
			ok: true,
			items: [],
			wires: [wire({ item: toItem, terminal: toTerminal })],
			how: 'wire'
		};
	}

	// A net-name mark beside the terminal, its own terminal facing it.
	const left = side === 'left';
	const label: EditorItem = {
		id: makeId('it'),
		kind: 'LABEL',
		name,
		value: '',
		x: snap(left ? p.x - 120 : side === 'right' ? p.x + 40 : p.x + 20),
		y: snap(side === 'top' ? p.y - 60 : side === 'bottom' ? p.y + 20 : p.y - 20),
		rotation: 0,
		flip: left
	};
	return {
		ok: true,
		items: [label],
		wires: [wire({ item: label.id, terminal: 't' })],
		how: 'name'
	};
}
