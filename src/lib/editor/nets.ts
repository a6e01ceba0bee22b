// Nets from the drawing: wires join terminals, every ground mark joins the reference net, and
// net names join all terminals carrying the same name (so two far-apart parts connect without
// a wire). A net's name comes from, in order: a net-name mark on it; the name pinned on its
// terminals (the snapshot's `netNames`: names a document brought, names people gave, and the
// names nets were first given — so a net keeps its name while the drawing changes around it);
// else n1, n2, … in drawing order, skipping names in use.
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

export function computeNets(
	items: EditorItem[],
	wires: Wire[],
	pinned: Record<string, string> = {}
): NetMap {
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
	// The output marker's − terminal left unwired observes against gnd (to-document.ts): it is on
	// the reference net, not a net of its own that pickers would offer as "n1".
	const wiredKeys = new Set(wires.flatMap((w) => [terminalKey(w.from), terminalKey(w.to)]));
	for (const it of items) {
		if (it.kind === 'PROBE' && !wiredKeys.has(`${it.id}:neg`)) union(`${it.id}:neg`, GROUND_KEY);
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
	// Pinned names, per root: the name most of its terminals carry (ties: alphabetically first).
	// Two nets claiming one name (a net split in two keeps its pins on both halves): the one with
	// more pinned terminals keeps it, ties in drawing order; the other gets a fresh name.
	const votes = new Map<string, Map<string, number>>();
	for (const k of order) {
		const name = pinned[k];
		if (!name || isGroundName(name)) continue;
		const r = find(k);
		if (r === groundRoot || labelName.has(r)) continue;
		const v = votes.get(r) ?? votes.set(r, new Map()).get(r)!;
		v.set(name, (v.get(name) ?? 0) + 1);
	}
	const claims: { root: string; name: string; count: number; at: number }[] = [];
	for (const [root, v] of votes) {
		const [name, count] = [...v].sort((a, b) => b[1] - a[1] || (a[0] < b[0] ? -1 : 1))[0];
		claims.push({ root, name, count, at: order.findIndex((k) => find(k) === root) });
	}
	claims.sort((a, b) => b.count - a.count || a.at - b.at);
	const pinnedName = new Map<string, string>();
	const usedPins = new Set<string>(labelName.values());
	for (const c of claims) {
		if (usedPins.has(c.name)) continue;
		usedPins.add(c.name);
		pinnedName.set(c.root, c.name);
	}
	const taken = new Set([...labelName.values(), ...pinnedName.values()]);
	const nameOf = new Map<string, string>();
	nameOf.set(groundRoot, GROUND_NET);
	let counter = 0;
	const nets = new Map<string, Net>();
	for (const k of order) {
		const r = find(k);
		let name = nameOf.get(r);
		if (!name) {
			name = labelName.get(r) ?? pinnedName.get(r);
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

/** Pins for every terminal on its net's current name: what keeps names stable across edits. */
export function pinAll(nets: NetMap): Record<string, string> {
	const out: Record<string, string> = {};
	for (const net of nets.nets) if (!net.grounded) for (const t of net.terminals) out[t] = net.name;
	return out;
}

/** Why a net name is refused (null: fine). Same rules as a part's name, and not the reference. */
export function netNameProblem(nets: NetMap, current: string, name: string): string | null {
	const n = name.trim();
	if (!n) return 'a net needs a name';
	if (isGroundName(n)) return `"${n}" is the reference node; use a ground mark to join it`;
	if (!/^[A-Za-z][A-Za-z0-9_.-]{0,63}$/.test(n))
		return 'a net name starts with a letter and has letters, digits, _ . - (at most 64)';
	if (n !== current && nets.nets.some((x) => x.name === n))
		return `another net is already called "${n}"`;
	return null;
}
