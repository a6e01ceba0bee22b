import { Triplets, type Csc } from '../kernels/csc';
import { ldlSymbolic, type LdlSymbolic } from '../kernels/ldl';
import { GROUND, type ResolvedNetwork } from '../types';
import { onUnion } from './sparse-mna';

/**
 * Reciprocal RC networks (R, C, grounded V sources, I sources) in reduced nodal form: the
 * unknowns are the node voltages not fixed by a source, so
 *
 *     (G + s·C)·v = (gIn + s·cIn)·u        (V input; gIn, cIn couple the input node)
 *     (G + s·C)·v = e_p − e_n · u          (I input into p)
 *
 * G and C are symmetric and both are diagonally dominant M-matrices: off-diagonals −g, −C, and
 * each row's sum is the conductance (capacitance) from that node to ground or to a source node,
 * summed here from the elements — the "excess" the accurate factorization needs (ldl.ts). With G
 * nonsingular the pencil is symmetric definite: real poles, orthogonal modes, Lanczos applies.
 *
 * Null when the network is not of this kind (inductors, controlled sources, op-amps, a floating
 * V source, an output or input the form cannot express); the general path takes those.
 */
export interface NodalRC {
	n: number;
	/** Network node → unknown index, or −1 for ground and source-held nodes. */
	unknownOf: Int32Array;
	pattern: Csc;
	g: Float64Array;
	c: Float64Array;
	gExcess: Float64Array;
	cExcess: Float64Array;
	inputKind: 'V' | 'I';
	/** Right-hand side per unit input: b(s) = rhsG + s·rhsC. */
	rhsG: Float64Array;
	rhsC: Float64Array;
	/** Output = v[plus] − v[minus] + constant·u (−1: that side is a reference). */
	out: { plus: number; minus: number; constant: number };
	/** V input: conductance and capacitance from the input node to everything (its self-admittance). */
	selfG: number;
	selfC: number;
	/** Every C element (index into net.elements) with its terminals' unknown indices (−1: reference). */
	caps: { element: Int32Array; a: Int32Array; b: Int32Array };
	/** DC component of each unknown (resistor paths); `n` stands for the reference. */
	component: Int32Array;
	floating: boolean;
}

export function nodalRC(net: ResolvedNetwork): NodalRC | null {
	const els = net.elements;
	const nn = net.nodeNames.length;
	const heldValue = new Float64Array(nn).fill(NaN);
	for (let k = 0; k < els.length; k++) {
		const e = els[k];
		if (e.type === 'R' || e.type === 'C' || e.type === 'I') continue;
		if (e.type !== 'V') return null;
		const [a, b] = e.nodes;
		if ((a === GROUND) === (b === GROUND)) return null; // floating source: general path
		const node = a === GROUND ? b : a;
		if (!Number.isNaN(heldValue[node])) return null;
		// The input source holds its node at ±u (orientation); the others at 0.
		heldValue[node] = k === net.input ? (a === GROUND ? -1 : 1) : 0;
	}
	const unknownOf = new Int32Array(nn).fill(-1);
	let n = 0;
	for (let i = 0; i < nn; i++) if (Number.isNaN(heldValue[i])) unknownOf[i] = n++;
	const idx = (node: number) => (node === GROUND ? -1 : unknownOf[node]);
	const held = (node: number) => (node === GROUND ? 0 : heldValue[node]);
	const gt = new Triplets(n, 4 * els.length + 8);
	const ct = new Triplets(n, 4 * els.length + 8);
	const gExcess = new Float64Array(n);
	const cExcess = new Float64Array(n);
	const rhsG = new Float64Array(n);
	const rhsC = new Float64Array(n);
	const capCount = els.reduce((s, e) => s + (e.type === 'C' ? 1 : 0), 0);
	const caps = {
		element: new Int32Array(capCount),
		a: new Int32Array(capCount),
		b: new Int32Array(capCount)
	};
	let ci = 0;
	const input = els[net.input];
	const inputKind = input.type === 'V' ? 'V' : 'I';
	const inputNode =
		inputKind === 'V' ? (input.nodes[0] === GROUND ? input.nodes[1] : input.nodes[0]) : -2;
	let selfG = 0;
	let selfC = 0;
	// Union-find over unknowns with `n` as the reference, for the DC components.
	const parent = new Int32Array(n + 1).map((_, i) => i);
	const find = (x: number): number => {
		while (parent[x] !== x) x = parent[x] = parent[parent[x]];
		return x;
	};
	for (let k = 0; k < els.length; k++) {
		const e = els[k];
		if (e.type !== 'R' && e.type !== 'C') continue;
		const y = e.type === 'R' ? 1 / e.value : e.value;
		const [a, b] = [e.nodes[0], e.nodes[1]];
		const [ia, ib] = [idx(a), idx(b)];
		const t = e.type === 'R' ? gt : ct;
		const excess = e.type === 'R' ? gExcess : cExcess;
		const rhs = e.type === 'R' ? rhsG : rhsC;
		if (e.type === 'C') {
			caps.element[ci] = k;
			caps.a[ci] = ia;
			caps.b[ci++] = ib;
		}
		if (a === inputNode || b === inputNode) {
			if (e.type === 'R') selfG += y;
			else selfC += y;
		}
		for (const [i, j, other] of [
			[ia, ib, b],
			[ib, ia, a]
		] as const) {
			if (i < 0) continue;
			t.add(i, i, y);
			if (j >= 0) t.add(i, j, -y);
			else {
				excess[i] += y;
				rhs[i] += y * held(other);
			}
		}
		if (e.type === 'R') parent[find(ia < 0 ? n : ia)] = find(ib < 0 ? n : ib);
	}
	let out: NodalRC['out'];
	{
		const { node, reference } = net.output;
		out = {
			plus: idx(node),
			minus: idx(reference),
			constant:
				(node === GROUND || unknownOf[node] < 0 ? held(node) : 0) -
				(reference === GROUND || unknownOf[reference] < 0 ? held(reference) : 0)
		};
	}
	if (inputKind === 'I') {
		const [p, q] = [input.nodes[0], input.nodes[1]];
		if (idx(p) >= 0) rhsG[idx(p)] += 1;
		if (idx(q) >= 0) rhsG[idx(q)] -= 1;
	}
	const { pattern, values } = onUnion(n, [gt, ct]);
	const component = new Int32Array(n + 1);
	let floating = false;
	const ref = find(n);
	for (let i = 0; i <= n; i++) {
		component[i] = find(i) === ref ? n : find(i);
		if (component[i] !== n) floating = true;
	}
	return {
		n,
		unknownOf,
		pattern,
		g: values[0],
		c: values[1],
		gExcess,
		cExcess,
		inputKind,
		rhsG,
		rhsC,
		out,
		selfG,
		selfC,
		caps,
		component,
		floating
	};
}

/**
 * The DC output and input readings from a factor of G (per unit input): output = outᵀ·v +
 * constant; the input functional is the current a V input delivers (selfG − rhsGᵀ·v, whatever
 * the source's orientation) or the voltage across an I input — the readings sparse-mna.ts's
 * functionals give, so both routes feed impedanceFromReading alike.
 */
export function rcDcReadings(
	rc: NodalRC,
	solve: (b: Float64Array) => Float64Array,
	inputNodes: [number, number]
): { h: number; zin: number } {
	const v = solve(rc.rhsG.slice());
	const at = (i: number) => (i >= 0 ? v[i] : 0);
	const h = at(rc.out.plus) - at(rc.out.minus) + rc.out.constant;
	if (rc.inputKind === 'V') {
		let s = rc.selfG;
		for (let i = 0; i < rc.n; i++) s -= rc.rhsG[i] * v[i];
		return { h, zin: s };
	}
	const [p, q] = inputNodes.map((x) => (x === GROUND ? -1 : rc.unknownOf[x]));
	return { h, zin: at(p) - at(q) };
}

const symbolicCache = new WeakMap<NodalRC, LdlSymbolic>();
/** One symbolic analysis (order, tree, pattern) per network: every factor of G + s·C shares it. */
export function symbolicOf(rc: NodalRC): LdlSymbolic {
	let s = symbolicCache.get(rc);
	if (!s) {
		s = ldlSymbolic(rc.pattern);
		symbolicCache.set(rc, s);
	}
	return s;
}
