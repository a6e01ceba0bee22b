import { stampNetwork, type Port, type ReactiveMode, type Sparse } from '../assemble';
import { Triplets, cscFromTriplets, type Csc } from '../kernels/csc';
import type { ResolvedNetwork } from '../types';

/**
 * The modified nodal equations (G + sC)·x = b·u of assemble.ts in sparse form, G and C on one
 * common pattern (the union of both), so G + s·C for any s is a new value array on a pattern
 * whose fill-reducing order is computed once.
 */
export interface SparseMna {
	size: number;
	pattern: Csc;
	g: Float64Array;
	c: Float64Array;
	ports: Port[];
	b: Sparse;
	out: Sparse;
	zin: Sparse;
}

export function sparseMna(
	net: ResolvedNetwork,
	mode: (element: number) => ReactiveMode = () => 'pencil'
): SparseMna {
	let gt = new Triplets(0);
	const s = stampNetwork(net, mode, (size) => {
		gt = new Triplets(size, 4 * net.elements.length + 16);
		return (r, c, v) => gt.add(r, c, v);
	});
	const ct = new Triplets(s.size, 4 * s.ports.length + 16);
	for (const p of s.ports)
		for (const [r, x] of p.vec) for (const [c, y] of p.vec) ct.add(r, c, p.d * x * y);
	const { pattern, values } = onUnion(s.size, [gt, ct]);
	return {
		size: s.size,
		pattern,
		g: values[0],
		c: values[1],
		ports: s.ports,
		b: s.b,
		out: s.c,
		zin: s.zin
	};
}

/**
 * Several matrices of one size on the union of their patterns: each triplet list is compressed
 * together with the others' places as explicit zeros, so every result has the same pattern.
 */
export function onUnion(n: number, lists: Triplets[]): { pattern: Csc; values: Float64Array[] } {
	const total = lists.reduce((s, t) => s + t.count, 0);
	const values: Float64Array[] = [];
	let pattern: Csc | null = null;
	for (let which = 0; which < lists.length; which++) {
		const all = new Triplets(n, total + 1);
		lists.forEach((t, i) => {
			for (let e = 0; e < t.count; e++) all.add(t.rows[e], t.cols[e], i === which ? t.vals[e] : 0);
		});
		const a = cscFromTriplets(all, true);
		pattern ??= a;
		values.push(a.values);
	}
	pattern ??= cscFromTriplets(new Triplets(n), true);
	return { pattern, values };
}
