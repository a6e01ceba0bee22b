import { GROUND, type ResolvedNetwork } from './types';

/**
 * How a reactive element enters a set of equations:
 * - `pencil`: as itself (C into the C matrix, L as a branch with −L in C) — the network at s;
 * - `open` / `short`: removed / replaced by a 0 V branch — zero or infinite value at DC;
 * - `iport`: removed, with a current-injection port vector e_a − e_b (drive i, read v);
 * - `vport`: a 0 V branch whose row is the port (drive v, read the branch current a→b).
 */
export type ReactiveMode = 'pencil' | 'open' | 'short' | 'iport' | 'vport';

/** Sparse vector: [row, coefficient] pairs. */
export type Sparse = [number, number][];

export interface Port {
	element: number;
	vec: Sparse;
	/** C for a capacitor, −L for an inductor: the pencil's C = Σ d·vec·vecᵀ (see docs/methods.md). */
	d: number;
}

export interface Assembled {
	size: number;
	g: Float64Array;
	/** Ports in network.reactive order (for modes pencil/iport/vport; others absent). */
	ports: Port[];
	/** Input source unit excitation. */
	b: Sparse;
	/** Output functional v(node) − v(reference). */
	c: Sparse;
	/** Functional whose value gives the input impedance (see input-impedance.ts). */
	zin: Sparse;
}

/**
 * Modified nodal analysis: node voltages first, then one branch current per V, VCVS, CCVS,
 * OPAMP, L (and shorted/voltage-port reactive element). Every independent source other than
 * the input is at zero: V shorted (its branch stays, RHS 0), I open (no stamp at all).
 */
export function assemble(net: ResolvedNetwork, mode: (element: number) => ReactiveMode): Assembled {
	let g = new Float64Array(0);
	let size = 0;
	const stamped = stampNetwork(net, mode, (n) => {
		size = n;
		g = new Float64Array(n * n);
		return (r, c, v) => {
			g[r * size + c] += v;
		};
	});
	return { ...stamped, g };
}

/** Where stamps go: `add(row, column, value)` for rows and columns other than ground. */
export type StampSink = (row: number, col: number, value: number) => void;

/**
 * The stamps themselves, for any storage: `open(size)` is called once the number of unknowns is
 * known and returns the sink (a dense array for small networks, triplets for the sparse path).
 */
export function stampNetwork(
	net: ResolvedNetwork,
	mode: (element: number) => ReactiveMode,
	open: (size: number) => StampSink
): Omit<Assembled, 'g'> {
	const nn = net.nodeNames.length;
	const branch = new Map<number, number>();
	let size = nn;
	net.elements.forEach((e, k) => {
		const m = e.type === 'C' || e.type === 'L' ? mode(k) : 'pencil';
		const needs =
			['V', 'VCVS', 'CCVS', 'OPAMP'].includes(e.type) ||
			(e.type === 'L' && m === 'pencil') ||
			m === 'short' ||
			m === 'vport';
		if (needs) branch.set(k, size++);
	});
	const sink = open(size);
	const add = (r: number, c: number, v: number) => {
		if (r !== GROUND && c !== GROUND) sink(r, c, v);
	};
	const kcl = (a: number, b: number, col: number, v = 1) => {
		add(a, col, v);
		add(b, col, -v);
	};
	const volt = (row: number, a: number, b: number, v = 1) => {
		add(row, a, v);
		add(row, b, -v);
	};
	const ports: Port[] = [];
	const pair = (a: number, b: number): Sparse =>
		[[a, 1] as [number, number], [b, -1] as [number, number]].filter(([r]) => r !== GROUND);

	net.elements.forEach((e, k) => {
		const [a, b, cp, cn] = e.nodes;
		const br = branch.get(k) ?? -1;
		switch (e.type) {
			case 'R':
				add(a, a, 1 / e.value);
				add(b, b, 1 / e.value);
				add(a, b, -1 / e.value);
				add(b, a, -1 / e.value);
				break;
			case 'C':
			case 'L': {
				const m = mode(k);
				if (m === 'open') break;
				if (m === 'iport') {
					ports.push({ element: k, vec: pair(a, b), d: e.type === 'C' ? e.value : -e.value });
					break;
				}
				if (e.type === 'C' && m === 'pencil') {
					ports.push({ element: k, vec: pair(a, b), d: e.value });
					break;
				}
				// L in the pencil, or any shorted / voltage-driven element: a branch a→b.
				kcl(a, b, br);
				volt(br, a, b);
				if (m === 'pencil' || m === 'vport') {
					ports.push({ element: k, vec: [[br, 1]], d: e.type === 'C' ? e.value : -e.value });
				}
				break;
			}
			case 'V':
				kcl(a, b, br);
				volt(br, a, b);
				break;
			case 'VCVS':
				kcl(a, b, br);
				volt(br, a, b);
				volt(br, cp, cn, -e.value);
				break;
			case 'CCVS':
				kcl(a, b, br);
				volt(br, a, b);
				add(br, branch.get(e.control)!, -e.value);
				break;
			case 'VCCS':
				add(a, cp, e.value);
				add(a, cn, -e.value);
				add(b, cp, -e.value);
				add(b, cn, e.value);
				break;
			case 'CCCS': {
				const ctl = branch.get(e.control)!;
				add(a, ctl, e.value);
				add(b, ctl, -e.value);
				break;
			}
			case 'OPAMP':
				// The output branch supplies whatever current node `out` needs; its row ties the inputs.
				add(e.nodes[2], br, -1);
				volt(br, e.nodes[0], e.nodes[1]);
				break;
			case 'I':
				break;
		}
	});

	const inp = net.elements[net.input];
	let bVec: Sparse;
	let zin: Sparse;
	if (inp.type === 'V') {
		const br = branch.get(net.input)!;
		bVec = [[br, 1]];
		// The branch current enters the source at p; the current the source delivers is its negative.
		zin = [[br, -1]];
	} else {
		// I pushes its current into node p: it appears on the right-hand side of KCL at p.
		bVec = pair(inp.nodes[0], inp.nodes[1]);
		zin = pair(inp.nodes[0], inp.nodes[1]);
	}
	const c = pair(net.output.node, net.output.reference);
	return { size, ports, b: bVec, c, zin };
}

export function dense(v: Sparse, size: number): Float64Array {
	const out = new Float64Array(size);
	for (const [r, x] of v) out[r] += x;
	return out;
}

export function dot(v: Sparse, x: Float64Array): number {
	// Indexed rather than destructured: this runs m² times per port model.
	let s = 0;
	for (let i = 0; i < v.length; i++) {
		const e = v[i];
		s += e[1] * x[e[0]];
	}
	return s;
}
