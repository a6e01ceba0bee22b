import { dot as sparseDot, type Sparse } from '../assemble';
import { multiplyValues } from '../kernels/csc';
import { axpy, dot, normalize } from '../kernels/lanczos';
import { luSolveSparse, luSolveSparseComplex, sparseLu, type SparseLu } from '../kernels/sparse-lu';
import type { SparseMna } from './sparse-mna';

/**
 * Responses of a large network.
 *
 * Frequency response and input impedance: one sparse complex factorization of G + jω·C per
 * point (the column order computed once), then the output and input functionals — the direct
 * solve, exact to round-off at every point, with no eigen-decomposition in between.
 *
 * Step response: from a reduced model. A Krylov basis V of (G + s0·C)⁻¹·C started at
 * (G + s0·C)⁻¹·b spans the first q moments of the transfer at s0; projecting the pencil on it
 * (Gr = Vᵀ·F·G·V, Cr = Vᵀ·F·C·V, br = Vᵀ·F·b, with F = −1 on the branch rows, which turns the
 * modified nodal form into one with G + Gᵀ ⪰ 0 and C ⪰ 0 for passive networks) is PRIMA
 * (Odabasioglu, Celik and Pileggi, IEEE TCAD 17(8), 1998): the congruence keeps a passive
 * network's model passive, so its step response cannot run away. The model is checked a
 * posteriori against the direct solves at several frequencies of the sweep; when it misses by
 * more than 1e-3 (relative to the response's scale) q is doubled, and if it still misses the
 * step is not reported (null with a warning) rather than drawn wrong.
 */
export interface Sweep {
	f: number[];
	h: { re: number; im: number }[];
	zin: { re: number; im: number }[];
}

export function sweep(mna: SparseMna, order: Int32Array, f: number[]): Sweep {
	const { size: n, pattern, g, c } = mna;
	const h: Sweep['h'] = [];
	const zin: Sweep['zin'] = [];
	const br = new Float64Array(n);
	const bi = new Float64Array(n);
	for (const freq of f) {
		const w = 2 * Math.PI * freq;
		const fac = sparseLu(
			{ ...pattern, values: g },
			Float64Array.from(c, (v) => w * v),
			order
		);
		br.fill(0);
		bi.fill(0);
		for (const [r, x] of mna.b) br[r] += x;
		if (fac.singular) {
			h.push({ re: NaN, im: NaN });
			zin.push({ re: NaN, im: NaN });
			continue;
		}
		luSolveSparseComplex(fac, br, bi);
		h.push({ re: sparseDot(mna.out, br), im: sparseDot(mna.out, bi) });
		zin.push({ re: sparseDot(mna.zin, br), im: sparseDot(mna.zin, bi) });
	}
	return { f, h, zin };
}

export interface ReducedModel {
	q: number;
	s0: number;
	gr: Float64Array;
	cr: Float64Array;
	br: Float64Array;
	lr: Float64Array;
}

/** PRIMA: q Krylov vectors at s0 (factor of G + s0·C given), projected with F. */
export function primaModel(
	mna: SparseMna,
	factor: SparseLu,
	s0: number,
	q: number,
	nodeCount: number
): ReducedModel {
	const { size: n, pattern, g, c } = mna;
	const V: Float64Array[] = [];
	let v = new Float64Array(n);
	for (const [r, x] of mna.b) v[r] += x;
	luSolveSparse(factor, v);
	const w = new Float64Array(n);
	for (let j = 0; j < Math.min(q, n); j++) {
		for (let pass = 0; pass < 2; pass++) for (const u of V) axpy(-dot(u, v), u, v);
		if (!(normalize(v) > 0)) break;
		V.push(v);
		multiplyValues(pattern, c, v, w);
		v = w.slice();
		luSolveSparse(factor, v);
	}
	const m = V.length;
	const flip = (x: Float64Array) => {
		for (let i = nodeCount; i < n; i++) x[i] = -x[i];
		return x;
	};
	const project = (values: Float64Array) => {
		const out = new Float64Array(m * m);
		const t = new Float64Array(n);
		for (let j = 0; j < m; j++) {
			flip(multiplyValues(pattern, values, V[j], t));
			for (let i = 0; i < m; i++) out[i * m + j] = dot(V[i], t);
		}
		return out;
	};
	const bFull = new Float64Array(n);
	for (const [r, x] of mna.b) bFull[r] += x;
	flip(bFull);
	const lFull = new Float64Array(n);
	for (const [r, x] of mna.out as Sparse) lFull[r] += x;
	return {
		q: m,
		s0,
		gr: project(g),
		cr: project(c),
		br: Float64Array.from(V, (u) => dot(u, bFull)),
		lr: Float64Array.from(V, (u) => dot(u, lFull))
	};
}
