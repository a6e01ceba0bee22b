import { GROUND, type ResolvedElement, type ResolvedNetwork } from './types';

/**
 * A port of the time-constant view: a node pair, not an element. Capacitors across the same
 * node pair are one port (their capacitances add); inductors in series in one branch — joined
 * through nodes that nothing else touches — are one port (their inductances add). Treating two
 * parallel capacitors as two ports gives the second one "τ = 0" (the first shorts it) and
 * spoils every estimate built on the ports; the physics sees one capacitance.
 */
export interface ReactivePort {
	/** The port's name: its members' ids joined by " + " (a lone element: its id). */
	id: string;
	kind: 'C' | 'L';
	/** Element indices in document order. */
	members: number[];
	/** Total capacitance (parallel) or inductance (series), SI units. */
	value: number;
	/** The node pair, oriented as the first member (chain ends for series inductors). */
	nodes: [number, number];
}

export interface PortNetwork {
	/** The network with each port as one element; `net.reactive[i]` is `ports[i]`. */
	net: ResolvedNetwork;
	ports: ReactivePort[];
}

/**
 * Group the reactive elements into ports and return the network the time-constant views run on.
 * Only the reactive elements change: each group becomes one element of the total value in the
 * place of its first member; every other element keeps its order (controls re-indexed).
 * The inner nodes of a series-inductor chain are left untouched (a DC solve anchors them).
 * Without any group the network itself is returned, so both back ends pay nothing.
 */
export function groupReactivePorts(net: ResolvedNetwork): PortNetwork {
	const els = net.elements;
	const groups = [...parallelCapacitors(net), ...seriesInductors(net)];
	const groupOf = new Map<number, number[]>();
	for (const g of groups) for (const k of g) groupOf.set(k, g);
	if (groups.length === 0) {
		return { net, ports: net.reactive.map((k) => single(els[k], k)) };
	}
	const ids = new Set(els.map((e) => e.id));
	const newIndex = new Int32Array(els.length).fill(-1);
	const elements: ResolvedElement[] = [];
	const ports: ReactivePort[] = [];
	const reactive: number[] = [];
	els.forEach((e, k) => {
		const g = groupOf.get(k);
		if (g && g[0] !== k) return; // folded into the group's first member
		newIndex[k] = elements.length;
		if (e.type !== 'C' && e.type !== 'L') {
			elements.push(e);
			return;
		}
		const port = g ? grouped(net, g, ids) : single(e, k);
		reactive.push(elements.length);
		ports.push(port);
		elements.push({ ...e, id: port.id, nodes: [...port.nodes], value: port.value });
	});
	const remapped = elements.map((e) =>
		e.control >= 0 ? { ...e, control: newIndex[e.control] } : e
	);
	return {
		net: { ...net, elements: remapped, input: newIndex[net.input], reactive },
		ports
	};
}

function single(e: ResolvedElement, k: number): ReactivePort {
	return {
		id: e.id,
		kind: e.type as 'C' | 'L',
		members: [k],
		value: e.value,
		nodes: [e.nodes[0], e.nodes[1]]
	};
}

function grouped(net: ResolvedNetwork, g: number[], ids: Set<string>): ReactivePort {
	const els = net.elements;
	const first = els[g[0]];
	let id = g.map((k) => els[k].id).join(' + ');
	while (ids.has(id)) id += ' (port)';
	ids.add(id);
	const value = g.reduce((s, k) => s + els[k].value, 0);
	const nodes: [number, number] =
		first.type === 'C' ? [first.nodes[0], first.nodes[1]] : chainEnds(net, g);
	return { id, kind: first.type as 'C' | 'L', members: g, value, nodes };
}

/** One number per unordered node pair (ground is −1; node counts stay far below 2²⁶). */
const pairKey = (a: number, b: number) =>
	a < b ? (a + 1) * 67108864 + b + 1 : (b + 1) * 67108864 + a + 1;

/** Capacitors on the same unordered node pair; a set whose capacitances cancel stays apart. */
function parallelCapacitors(net: ResolvedNetwork): number[][] {
	const byPair = new Map<number, number[]>();
	for (const k of net.reactive) {
		const e = net.elements[k];
		if (e.type !== 'C') continue;
		const key = pairKey(e.nodes[0], e.nodes[1]);
		const list = byPair.get(key);
		if (list) list.push(k);
		else byPair.set(key, [k]);
	}
	return [...byPair.values()].filter(
		(g) => g.length > 1 && g.reduce((s, k) => s + net.elements[k].value, 0) !== 0
	);
}

/**
 * Inductors joined through inner nodes: a node (not ground, not the output or its reference)
 * that exactly two element terminals touch, both inductors. Controlled-source control
 * terminals count as touches, so a node something senses is never folded away.
 */
function seriesInductors(net: ResolvedNetwork): number[][] {
	const els = net.elements;
	const touches = new Map<number, number[]>();
	els.forEach((e, k) => {
		for (const n of e.nodes) {
			if (n === GROUND) continue;
			const t = touches.get(n);
			if (t) t.push(k);
			else touches.set(n, [k]);
		}
	});
	const parent = new Map<number, number>();
	const find = (k: number): number => {
		let r = k;
		while (parent.get(r) !== r) r = parent.get(r)!;
		return r;
	};
	for (const [n, t] of touches) {
		if (n === net.output.node || n === net.output.reference || t.length !== 2) continue;
		const [a, b] = t;
		if (a === b || els[a].type !== 'L' || els[b].type !== 'L') continue;
		for (const k of [a, b]) if (!parent.has(k)) parent.set(k, k);
		const ra = find(a);
		const rb = find(b);
		if (ra !== rb) parent.set(Math.max(ra, rb), Math.min(ra, rb));
	}
	const byRoot = new Map<number, number[]>();
	for (const k of [...parent.keys()].sort((x, y) => x - y)) {
		const r = find(k);
		const list = byRoot.get(r);
		if (list) list.push(k);
		else byRoot.set(r, [k]);
	}
	// An isolated loop of inductors has no ends; a chain whose inductances cancel stays apart.
	return [...byRoot.values()].filter(
		(g) =>
			g.length > 1 && endsOf(net, g).length === 2 && g.reduce((s, k) => s + els[k].value, 0) !== 0
	);
}

function endsOf(net: ResolvedNetwork, g: number[]): number[] {
	const count = new Map<number, number>();
	for (const k of g) for (const n of net.elements[k].nodes) count.set(n, (count.get(n) ?? 0) + 1);
	return [...count.entries()].filter(([, c]) => c === 1).map(([n]) => n);
}

/** The two nodes of a series chain that only one member touches, the first member's end first. */
function chainEnds(net: ResolvedNetwork, g: number[]): [number, number] {
	const [x, y] = endsOf(net, g); // exactly two: groups without are not formed
	// Orient as the first member where it touches an end.
	return net.elements[g[0]].nodes[1] === x ? [y, x] : [x, y];
}

/** Each reading with its port's member ids and total value (readings are in port order). */
export function withMembers<T extends { element: string }>(
	net: ResolvedNetwork,
	ports: ReactivePort[],
	readings: T[]
): (T & { members: string[]; value: number })[] {
	const byId = new Map(ports.map((p) => [p.id, p]));
	return readings.map((r) => {
		const p = byId.get(r.element);
		return {
			...r,
			members: p ? p.members.map((k) => net.elements[k].id) : [r.element],
			value: p ? p.value : NaN
		};
	});
}
