// Words for what is on the canvas, for screen readers and the canvas' live region: a part by its
// name, value and the nets it sits between ("R1, resistor 9 MΩ, between tip and adc"), a
// terminal by its net and what else is on it, a wire by its net and ends. Pure: the canvas
// passes in the drawing and its nets.
import { KINDS, hasValue, isCircuit } from './kinds';
import type { NetMap } from './nets';
import { terminalKey, type EditorItem, type Wire } from './types';

export interface DescribeContext {
	items: EditorItem[];
	wires: Wire[];
	nets: NetMap;
	/** Item id of the input source. */
	input?: string | null;
}

/** How a terminal is spoken: "terminal 1", "+ terminal", "out terminal". */
export function terminalWords(item: EditorItem, terminal: string): string {
	const t = KINDS[item.kind].terminals.find((x) => x.name === terminal);
	const label = t?.label ?? terminal;
	return /^\d+$/.test(label) ? `terminal ${label}` : `${label} terminal`;
}

/** The name people know an item by: its designator, or the mark it is. */
export function itemWords(item: EditorItem): string {
	if (item.kind === 'GND') return 'ground mark';
	if (item.kind === 'LABEL') return `net name ${item.name || '(unnamed)'}`;
	if (item.kind === 'PROBE') return 'output marker';
	return item.name || KINDS[item.kind].title.toLowerCase();
}

// Nets by name, built once per net map (the canvas describes every part on each change).
const byName = new WeakMap<NetMap, Map<string, NetMap['nets'][number]>>();
function netNamed(nets: NetMap, name: string) {
	let m = byName.get(nets);
	if (!m) byName.set(nets, (m = new Map(nets.nets.map((n) => [n.name, n]))));
	return m.get(name);
}

/** A terminal by its item and own name: "R1 terminal 2", "ground mark gnd terminal". */
export const terminalName = (item: EditorItem, terminal: string) =>
	`${itemWords(item)} ${terminalWords(item, terminal)}`;

/** The net a terminal is on, or null while nothing else is joined to it. */
export function netOf(ctx: DescribeContext, itemId: string, terminal: string): string | null {
	const key = `${itemId}:${terminal}`;
	const name = ctx.nets.byTerminal.get(key);
	if (!name) return null;
	const net = netNamed(ctx.nets, name);
	// A terminal alone on an unnamed net is an open end, whatever number the net got.
	if (net && net.terminals.length === 1 && !net.grounded && /^n\d+$/.test(name)) return null;
	return name;
}

/** Items other than `itemId` that have a terminal on `net`, as words, without repeats. */
function othersOn(ctx: DescribeContext, net: string, itemId: string): string[] {
	const found = netNamed(ctx.nets, net);
	if (!found) return [];
	const byId = new Map(ctx.items.map((i) => [i.id, i]));
	const names = new Set<string>();
	for (const key of found.terminals) {
		const id = key.slice(0, key.indexOf(':'));
		const it = byId.get(id);
		if (it && id !== itemId && isCircuit(it.kind)) names.add(itemWords(it));
	}
	return [...names];
}

const list = (xs: string[]) =>
	xs.length <= 1 ? (xs[0] ?? '') : `${xs.slice(0, -1).join(', ')} and ${xs[xs.length - 1]}`;

/** Items wired directly to any terminal of `item`. */
function wiredTo(ctx: DescribeContext, item: EditorItem): string[] {
	const byId = new Map(ctx.items.map((i) => [i.id, i]));
	const names = new Set<string>();
	for (const w of ctx.wires) {
		const other = w.from.item === item.id ? w.to.item : w.to.item === item.id ? w.from.item : null;
		const it = other ? byId.get(other) : undefined;
		if (it && it.id !== item.id) names.add(itemWords(it));
	}
	return [...names];
}

/** One line for a part or mark, e.g. "R1, resistor 9 MΩ, between tip and adc". */
export function describeItem(ctx: DescribeContext, item: EditorItem, shownValue?: string): string {
	const info = KINDS[item.kind];
	if (item.kind === 'GND' || item.kind === 'LABEL') {
		const w = wiredTo(ctx, item);
		const what = item.kind === 'GND' ? 'Ground mark' : `Net name ${item.name || '(unnamed)'}`;
		return w.length ? `${what}, wired to ${list(w)}` : `${what}, not wired`;
	}
	if (item.kind === 'PROBE') {
		const pos = netOf(ctx, item.id, 'pos');
		const neg = netOf(ctx, item.id, 'neg') ?? 'gnd';
		return pos ? `Output marker, ${pos} against ${neg}` : 'Output marker, not wired';
	}
	const parts = [item.name || info.title];
	const value = hasValue(item.kind) ? (shownValue ?? item.value).trim() : '';
	parts.push(value ? `${info.title.toLowerCase()} ${value}` : info.title.toLowerCase());
	if (ctx.input === item.id) parts.push('the input');
	const terms = info.terminals.map((t) => ({ t, net: netOf(ctx, item.id, t.name) }));
	if (terms.length === 2) {
		const [a, b] = terms;
		if (a.net && b.net) parts.push(`between ${a.net} and ${b.net}`);
		else if (a.net || b.net)
			parts.push(
				`${terminalWords(item, (a.net ? a : b).t.name)} on ${a.net ?? b.net}, ${terminalWords(item, (a.net ? b : a).t.name)} open`
			);
		else parts.push('not wired');
	} else {
		parts.push(
			terms
				.map(({ t, net }) => `${terminalWords(item, t.name)} ${net ? `on ${net}` : 'open'}`)
				.join(', ')
		);
	}
	return parts.join(', ');
}

/** One line for a terminal: "R1 terminal 2, on tip with C1 and R2" or "…, open". */
export function describeTerminal(ctx: DescribeContext, item: EditorItem, terminal: string): string {
	const head = terminalName(item, terminal);
	const net = netOf(ctx, item.id, terminal);
	if (!net) return `${head}, open`;
	const others = othersOn(ctx, net, item.id);
	return others.length ? `${head}, on ${net} with ${list(others)}` : `${head}, on ${net}`;
}

/** One line for a wire: "Wire on tip, R1 terminal 2 to C1 terminal 1". */
export function describeWire(ctx: DescribeContext, wire: Wire): string {
	const byId = new Map(ctx.items.map((i) => [i.id, i]));
	const end = (r: Wire['from']) => {
		const it = byId.get(r.item);
		return it ? terminalName(it, r.terminal) : 'a missing part';
	};
	const net = ctx.nets.byTerminal.get(terminalKey(wire.from));
	return `Wire${net ? ` on ${net}` : ''}, ${end(wire.from)} to ${end(wire.to)}`;
}
