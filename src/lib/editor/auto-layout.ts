// A drawing for a network that has none (imported or API-made sheets, templates, the seed).
// Signal flows left to right: nets are placed in columns by their distance from the input
// source; an element between two nets lies horizontally between their columns (parallel ones
// stacked above), an element to ground hangs below its net with its own ground mark, and wires
// chain the terminals of each net from left to right. Plain, readable, and deterministic.
import type { NetworkDocument } from '$lib/network/schema';
import { KINDS, isCircuit, type ItemKind } from './kinds';
import { placedTerminals } from './geometry';
import type { EditorItem, Rotation, Snapshot, Wire } from './types';

const isGnd = (n: string | number) => String(n) === 'gnd' || String(n) === '0';
const ROW = 320;

interface Placed {
	item: EditorItem;
	nets: string[]; // per terminal in kind order
}

export function autoLayout(doc: NetworkDocument): Snapshot {
	const elements = doc.elements.filter((e) => isCircuit(e.type));
	const netOf = (n: string | number) => (isGnd(n) ? 'gnd' : String(n));
	// Column of each net: breadth-first distance from the input source's nodes.
	const adj = new Map<string, Set<string>>();
	const link = (a: string, b: string) => {
		if (a === 'gnd' || b === 'gnd' || a === b) return;
		(adj.get(a) ?? adj.set(a, new Set()).get(a)!).add(b);
		(adj.get(b) ?? adj.set(b, new Set()).get(b)!).add(a);
	};
	const allNets: string[] = [];
	for (const e of elements) {
		const ns = e.nodes.map(netOf);
		for (const n of ns) if (n !== 'gnd' && !allNets.includes(n)) allNets.push(n);
		for (let i = 1; i < ns.length; i++) link(ns[0], ns[i]);
		if (ns.length === 4) link(ns[2], ns[3]);
	}
	const col = new Map<string, number>();
	const input = elements.find((e) => e.id === doc.input);
	const starts = input ? input.nodes.map(netOf).filter((n) => n !== 'gnd') : [];
	for (const seed of [...starts, ...allNets]) {
		if (col.has(seed)) continue;
		const base = col.size === 0 ? 0 : Math.max(...col.values()) + 1;
		col.set(seed, base);
		const queue = [seed];
		while (queue.length) {
			const n = queue.shift()!;
			for (const m of adj.get(n) ?? []) {
				if (!col.has(m)) {
					col.set(m, col.get(n)! + 1);
					queue.push(m);
				}
			}
		}
	}
	// Rows inside a column, then the x of each column from how many parts hang below it.
	const row = new Map<string, number>();
	const perCol = new Map<number, number>();
	for (const n of allNets) {
		const c = col.get(n)!;
		row.set(n, perCol.get(c) ?? 0);
		perCol.set(c, (perCol.get(c) ?? 0) + 1);
	}
	const hanging = new Map<string, typeof elements>();
	const series: typeof elements = [];
	const primary = (ns: string[], type: ItemKind) =>
		type === 'OPAMP' ? ns[2] : ns[0] !== 'gnd' ? ns[0] : ns[1];
	for (const e of elements) {
		const ns = e.nodes.map(netOf);
		if (ns.length === 2 && ns[0] !== 'gnd' && ns[1] !== 'gnd') series.push(e);
		else {
			const p = primary(ns, e.type);
			(hanging.get(p) ?? hanging.set(p, []).get(p)!).push(e);
		}
	}
	const slots = (n: string) =>
		(hanging.get(n) ?? []).reduce(
			(s, e) => s + (KINDS[e.type].width > 40 && e.nodes.length > 2 ? 2 : 1),
			0
		);
	const maxCol = Math.max(0, ...col.values());
	const colX: number[] = [];
	let x = 0;
	for (let c = 0; c <= maxCol; c++) {
		colX.push(x);
		const widest = Math.max(1, ...allNets.filter((n) => col.get(n) === c).map(slots));
		x += 80 * widest + 200;
	}
	const anchor = (n: string) => ({ x: colX[col.get(n) ?? 0], y: 200 + (row.get(n) ?? 0) * ROW });

	const items: EditorItem[] = [];
	const placed: Placed[] = [];
	const add = (
		e: (typeof elements)[number],
		px: number,
		py: number,
		rotation: Rotation,
		flip = false
	) => {
		const item: EditorItem = {
			id: `it-${items.length + 1}`,
			kind: e.type,
			name: e.id,
			value: e.value === undefined ? '' : String(e.value),
			...(e.control ? { control: e.control } : {}),
			...(e.role && e.role !== 'design' ? { role: e.role } : {}),
			...(e.range ? { range: { min: String(e.range.min), max: String(e.range.max) } } : {}),
			x: Math.round(px / 20) * 20,
			y: Math.round(py / 20) * 20,
			rotation,
			flip
		};
		items.push(item);
		placed.push({ item, nets: e.nodes.map(netOf) });
		return item;
	};
	// Series parts between two columns; parallel ones stack upwards.
	const stack = new Map<string, number>();
	for (const e of series) {
		const [a, b] = e.nodes.map(netOf);
		const [l, r] = (col.get(a) ?? 0) <= (col.get(b) ?? 0) ? [a, b] : [b, a];
		// Everything leaving one net to the right stacks upwards (parallel parts and branches).
		const key = l;
		const k = stack.get(key) ?? 0;
		stack.set(key, k + 1);
		const pa = anchor(l);
		const pb = anchor(r);
		const left = pa.x + 80 * Math.max(1, slots(l)) + 20;
		const right = col.get(l) === col.get(r) ? left + 120 : pb.x;
		const cx = (left + right) / 2 - 40;
		const y = Math.min(pa.y, pb.y) - 100 - 60 * k;
		add(e, cx, y, 0, l !== a);
	}
	// Parts that hang from one net (to ground, sources, controlled sources, op-amps).
	for (const [n, list] of hanging) {
		const p = anchor(n);
		let slot = 0;
		for (const e of list) {
			const ns = e.nodes.map(netOf);
			const px = p.x + 80 * slot;
			slot += e.nodes.length > 2 ? 2 : 1;
			if (e.type === 'OPAMP') add(e, px, p.y - 40, 0);
			else if (e.nodes.length === 4) add(e, px, p.y, ns[0] === 'gnd' ? 180 : 0);
			else if (KINDS[e.type].height > KINDS[e.type].width)
				add(e, px, p.y, ns[0] === 'gnd' ? 180 : 0);
			else add(e, px - 20, p.y + 20, ns[0] === 'gnd' ? 270 : 90);
		}
	}
	return {
		title: doc.title ?? '',
		...wireUp(items, placed, doc),
		input: items.find((i) => i.name === doc.input)?.id ?? null
	};
}

function wireUp(
	items: EditorItem[],
	placed: Placed[],
	doc: NetworkDocument
): { items: EditorItem[]; wires: Wire[] } {
	const wires: Wire[] = [];
	const byNet = new Map<string, { item: string; terminal: string; x: number; y: number }[]>();
	const pin = (net: string, item: EditorItem, terminal: string, x: number, y: number) =>
		(byNet.get(net) ?? byNet.set(net, []).get(net)!).push({ item: item.id, terminal, x, y });
	const marks: EditorItem[] = [];
	for (const { item, nets } of placed) {
		const terms = placedTerminals(item);
		KINDS[item.kind].terminals.forEach((t, i) => {
			const pt = terms.find((p) => p.name === t.name)!;
			const ax = item.x + pt.x;
			const ay = item.y + pt.y;
			if (nets[i] === 'gnd') {
				// Its own ground mark just below (or beside) the terminal.
				const g: EditorItem = {
					id: `it-g${marks.length + 1}`,
					kind: 'GND',
					name: '',
					value: '',
					x: ax - 20,
					y: ay,
					rotation: 0,
					flip: false
				};
				// A terminal on the top edge gets an upside-down mark above it.
				if (pt.side === 'top') Object.assign(g, { y: ay - 40, rotation: 180 });
				marks.push(g);
				wires.push({
					id: `w-${wires.length + 1}`,
					from: { item: item.id, terminal: t.name },
					to: { item: g.id, terminal: 'g' }
				});
			} else pin(nets[i], item, t.name, ax, ay);
		});
	}
	// Output marker at the output node.
	const outNet = String(doc.output.node);
	const refNet = String(doc.output.reference ?? 'gnd');
	const outPins = byNet.get(outNet) ?? [];
	const rightmost = outPins.reduce(
		(m, p) => (p.x > m.x ? p : m),
		outPins[0] ?? { x: 0, y: 0, item: '', terminal: '' }
	);
	const probe: EditorItem = {
		id: 'it-out',
		kind: 'PROBE',
		name: '',
		value: '',
		x: Math.round((rightmost.x + 80) / 20) * 20,
		y: Math.round((rightmost.y - 20) / 20) * 20,
		rotation: 0,
		flip: false
	};
	if (outPins.length) {
		marks.push(probe);
		pin(outNet, probe, 'pos', probe.x, probe.y + 20);
		if (!isGnd(refNet)) pin(refNet, probe, 'neg', probe.x, probe.y + 60);
	}
	for (const pins of byNet.values()) {
		pins.sort((a, b) => a.x - b.x || a.y - b.y);
		for (let i = 1; i < pins.length; i++) {
			wires.push({
				id: `w-${wires.length + 1}`,
				from: { item: pins[i - 1].item, terminal: pins[i - 1].terminal },
				to: { item: pins[i].item, terminal: pins[i].terminal }
			});
		}
	}
	return { items: [...items, ...marks], wires };
}
