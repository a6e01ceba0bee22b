import { GROUND, type ResolvedNetwork } from '../types';

/**
 * Elmore delay of an RC tree in linear time (Elmore, "The transient response of damped linear
 * networks with particular regard to wideband amplifiers", J. Appl. Phys. 19(1), 1948): driven
 * at its root through a tree of resistors, with every capacitor from a tree node to ground, the
 * delay to node k is Σ_i R_ik·C_i, R_ik the resistance the paths root→i and root→k share.
 * Computed as T(k) = T(parent) + R(parent, k)·C_downstream(k): one pass up the tree for the
 * downstream capacitances, one pass down for the delays.
 *
 * Applies when the input is a grounded V source, the resistors form a tree spanning every node
 * from the input node (no resistor to ground, no loop), and every capacitor goes to ground.
 * Null otherwise (the first moment of a general network is not a tree sum).
 */
export function elmoreDelays(net: ResolvedNetwork): Float64Array | null {
	const els = net.elements;
	const nn = net.nodeNames.length;
	const input = els[net.input];
	if (input.type !== 'V' || (input.nodes[0] !== GROUND && input.nodes[1] !== GROUND)) return null;
	const root = input.nodes[0] === GROUND ? input.nodes[1] : input.nodes[0];
	const cap = new Float64Array(nn);
	const head = new Int32Array(nn).fill(-1);
	const next: number[] = [];
	const to: number[] = [];
	const res: number[] = [];
	let resistors = 0;
	for (const e of els) {
		if (e === input) continue;
		if (e.type === 'C') {
			const [a, b] = e.nodes;
			if (a !== GROUND && b !== GROUND) return null;
			cap[a === GROUND ? b : a] += e.value;
		} else if (e.type === 'R') {
			const [a, b] = e.nodes;
			if (a === GROUND || b === GROUND) return null;
			resistors++;
			for (const [x, y] of [
				[a, b],
				[b, a]
			]) {
				to.push(y);
				res.push(e.value);
				next.push(head[x]);
				head[x] = to.length - 1;
			}
		} else return null;
	}
	if (resistors !== nn - 1) return null;
	// Breadth-first from the root: parent links and an order in which parents come first.
	const parent = new Int32Array(nn).fill(-2);
	const rUp = new Float64Array(nn);
	const order = new Int32Array(nn);
	parent[root] = -1;
	order[0] = root;
	let count = 1;
	for (let h = 0; h < count; h++) {
		const x = order[h];
		for (let e = head[x]; e >= 0; e = next[e]) {
			const y = to[e];
			if (parent[y] !== -2) {
				if (y !== parent[x]) return null; // a loop
				continue;
			}
			parent[y] = x;
			rUp[y] = res[e];
			order[count++] = y;
		}
	}
	if (count !== nn) return null;
	const down = Float64Array.from(cap);
	for (let h = nn - 1; h > 0; h--) down[parent[order[h]]] += down[order[h]];
	const delay = new Float64Array(nn);
	for (let h = 1; h < nn; h++) {
		const x = order[h];
		delay[x] = delay[parent[x]] + rUp[x] * down[x];
	}
	return delay;
}
