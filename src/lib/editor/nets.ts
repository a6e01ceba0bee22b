// Nets from the drawing: wires join terminals, every ground mark joins the reference net, and
// net names join all terminals carrying the same name (so two far-apart parts connect without
// a wire). Unnamed nets get n1, n2, … in drawing order, skipping names people have used.
import { KINDS } from './kinds';
import { terminalKey, type EditorItem, type Wire } from './types';

export interface Net {
	name: string;
	/** Terminal keys "item:terminal" on this net. */
	terminals: string[];
	grounded: boolean;
}

export interface NetMap {
	nets: Net[];
	/** terminal key → net name */
	byTerminal: Map<string, string>;
}

export const GROUND_NET = 'gnd';
const isGroundName = (n: string) => n === 'gnd' || n === '0';

export function computeNets(items: EditorItem[], wires: Wire[]): NetMap {
	const parent = new Map<string, string>();
	const find = (k: string): string => {
		let x = k;
		while (parent.get(x) !== x) {
			const p = parent.get(x)!;
			parent.set(x, parent.get(p)!);
			x = p;
		}
		return x;
	};
	const union = (a: string, b: string) => {
		const ra = find(a);
		const rb = find(b);
		if (ra !== rb) parent.set(ra, rb);
	};
	const order: string[] = [];
	for (const it of items) {
		for (const t of KINDS[it.kind].terminals) {
			const k = `${it.id}:${t.name}`;
			parent.set(k, k);
			order.push(k);
		}
	}
	// Virtual keys for ground and for each used net name.
	const GROUND_KEY = '#gnd';
	parent.set(GROUND_KEY, GROUND_KEY);
	const labelKey = (name: string) => (isGroundName(name) ? GROUND_KEY : `#label:${name}`);
	for (const w of wires) {
		const a = terminalKey(w.from);
		const b = terminalKey(w.to);
		if (parent.has(a) && parent.has(b)) union(a, b);
	}
	for (const it of items) {
		if (it.kind === 'GND') union(`${it.id}:g`, GROUND_KEY);
		if (it.kind === 'LABEL' && it.name.trim()) {
			const lk = labelKey(it.name.trim());
			if (!parent.has(lk)) parent.set(lk, lk);
			union(`${it.id}:t`, lk);
		}
	}
	const groundRoot = find(GROUND_KEY);
	// Names carried by labels, per root (alphabetically first wins when two names meet).
	const labelName = new Map<string, string>();
	for (const it of items) {
		if (it.kind !== 'LABEL' || !it.name.trim()) continue;
		const r = find(`${it.id}:t`);
		const n = it.name.trim();
		const prev = labelName.get(r);
		if (!prev || n < prev) labelName.set(r, n);
	}
	const taken = new Set(labelName.values());
	const nameOf = new Map<string, string>();
	nameOf.set(groundRoot, GROUND_NET);
	let counter = 0;
	const nets = new Map<string, Net>();
	for (const k of order) {
		const r = find(k);
		let name = nameOf.get(r);
		if (!name) {
			name = labelName.get(r);
			if (!name) {
				do counter++;
				while (taken.has(`n${counter}`));
				name = `n${counter}`;
			}
			nameOf.set(r, name);
		}
		let net = nets.get(name);
		if (!net) {
			net = { name, terminals: [], grounded: r === groundRoot };
			nets.set(name, net);
		}
		net.terminals.push(k);
	}
	const byTerminal = new Map<string, string>();
	for (const net of nets.values()) for (const t of net.terminals) byTerminal.set(t, net.name);
	return { nets: [...nets.values()], byTerminal };
}
