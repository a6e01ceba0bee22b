import { hessenberg, hqr, type Hessenberg } from './eigen';
import { eigenvectors, type EigenPair } from './eigenvectors';
import type { PortModel } from './port-model';
import { symmetricEigen } from './symmetric-eigen';

/**
 * Eigenvalues μ of a shifted port matrix, mapped to natural frequencies s = s0 − 1/μ.
 * μ = 0 stands for s = ∞ (a capacitor loop, an inductor cut set, a capacitor across a source):
 * in exact arithmetic those are exact zeros, in floating point they come out near
 * ε·max|μ|. Genuine poles ten decades above the shift sit at 1e-10·max|μ|, so the cut at
 * 1e-12 leaves a margin of about a hundred on each side; polishing then restores full
 * accuracy to the small ones (poles.ts).
 */
export const INFINITE_MU = 1e-12;

export interface Spectrum {
	/** Hessenberg form for inverse iteration; null on the symmetric path (vectors are in `s`). */
	hs: Hessenberg | null;
	/** Kept eigenvalues (finite s), with their μ (and their vectors on the symmetric path). */
	s: { re: number; im: number; muRe: number; muIm: number; vectors?: EigenPair }[];
	/** All μ, for the frequency-response solves. */
	mu: { re: Float64Array; im: Float64Array };
	s0: number;
	/** Symmetric path: the eigen-decomposition of S = D^½·H·D^½ (zeros-deflated.ts reuses it). */
	basis?: SymmetricBasis;
}

/**
 * S's finite modes, and its infinite ones (μ ≈ 0: capacitor loops, capacitors across a source)
 * only through the inner product they define, which is all the deflated zero problem needs
 * (zeros-deflated.ts). The node path (node-space-spectrum.ts) never forms most infinite vectors.
 */
export interface SymmetricBasis {
	/** The finite eigenvalues (|μ| above the INFINITE_MU cut), in the order of Spectrum.s. */
	values: Float64Array;
	/** Row k (length m): the unit eigenvector of values[k] in port coordinates. */
	vectors: Float64Array;
	sqrtD: Float64Array;
	/** xᵀ·P∞·y, P∞ the orthogonal projector on the infinite modes (the complement of `vectors`). */
	infiniteProduct: (x: Float64Array, y: Float64Array) => number;
}

/** M = D·A for a row-major m×m A (rows scaled by d). */
export function scaleRows(a: Float64Array, d: Float64Array, m: number): Float64Array {
	const out = new Float64Array(m * m);
	for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) out[i * m + j] = d[i] * a[i * m + j];
	return out;
}

export function spectrum(M: Float64Array, m: number, s0: number, wantVectors = true): Spectrum {
	const hs = hessenberg(M, m, wantVectors);
	const mu = hqr(hs);
	let max = 0;
	for (let i = 0; i < m; i++) max = Math.max(max, Math.hypot(mu.re[i], mu.im[i]));
	const s: Spectrum['s'] = [];
	for (let i = 0; i < m; i++) {
		const a = mu.re[i];
		const b = mu.im[i];
		const r2 = a * a + b * b;
		if (!(Math.sqrt(r2) > INFINITE_MU * max)) continue;
		// s = s0 − 1/μ, with 1/μ = conj(μ)/|μ|².
		s.push({ re: s0 - a / r2, im: b / r2, muRe: a, muIm: b });
	}
	return { hs, s, mu, s0 };
}

export function vectorsFor(sp: Spectrum, muRe: number, muIm: number): EigenPair {
	if (!sp.hs) throw new Error('symmetric spectrum: vectors come with the eigenvalues');
	return eigenvectors(sp.hs, muRe, muIm);
}

/**
 * The symmetric path for reciprocal networks with every d > 0 (RC networks): the pole matrix
 * M = D·H is similar to S = D^½·H·D^½, symmetric when H is. For S v = μ v the right and left
 * eigenvectors of M are x = D^½ v and y = D^-½ v (yᵀx = 1), so participation x_k·y_k is v_k².
 * H is symmetrized by averaging: for a reciprocal network its asymmetry is factorization
 * round-off, and the average is at least as close to the exact matrix. Null when it does not
 * apply or the iteration fails (the caller takes the general path).
 */
export function symmetricSpectrum(pm: PortModel): Spectrum | null {
	const m = pm.m;
	const { d, H } = pm;
	for (let i = 0; i < m; i++) if (!(d[i] > 0) || !Number.isFinite(d[i])) return null;
	const r = new Float64Array(m);
	for (let i = 0; i < m; i++) r[i] = Math.sqrt(d[i]);
	const S = new Float64Array(m * m);
	for (let i = 0; i < m; i++) {
		for (let j = i; j < m; j++) {
			const v = 0.5 * (H[i * m + j] + H[j * m + i]) * r[i] * r[j];
			S[i * m + j] = v;
			S[j * m + i] = v;
		}
	}
	const eig = symmetricEigen(S, m);
	if (!eig) return null;
	const muRe = eig.values;
	const mu = { re: Float64Array.from(muRe), im: new Float64Array(m) };
	let max = 0;
	for (let i = 0; i < m; i++) max = Math.max(max, Math.abs(muRe[i]));
	const s: Spectrum['s'] = [];
	const finite: number[] = [];
	const infinite: number[] = [];
	for (let k = 0; k < m; k++) {
		const a = muRe[k];
		if (!(Math.abs(a) > INFINITE_MU * max)) {
			infinite.push(k);
			continue;
		}
		finite.push(k);
		const vectors = portPair(eig.vectors.subarray(k * m, k * m + m), r);
		s.push({ re: pm.s0 - 1 / a, im: 0, muRe: a, muIm: 0, vectors });
	}
	const V = eig.vectors;
	const basis: SymmetricBasis = {
		values: Float64Array.from(finite, (k) => muRe[k]),
		vectors: Float64Array.from(finite.flatMap((k) => Array.from(V.subarray(k * m, k * m + m)))),
		sqrtD: r,
		infiniteProduct: (x, y) => {
			let c = 0;
			for (const k of infinite) c += dot(V, k * m, x) * dot(V, k * m, y);
			return c;
		}
	};
	return { hs: null, s, mu, s0: pm.s0, basis };
}

/** Σ a[from + i]·x[i] over x's length. */
export function dot(a: Float64Array, from: number, x: Float64Array): number {
	let s = 0;
	for (let i = 0; i < x.length; i++) s += a[from + i] * x[i];
	return s;
}

/**
 * For S v = μ v, the right and left eigenvectors of M = D·H, x = D^½ v and y = D^-½ v, each
 * scaled as on the general path (largest entry 1).
 */
export function portPair(v: Float64Array, sqrtD: Float64Array): EigenPair {
	const m = v.length;
	const xr = new Float64Array(m);
	const yr = new Float64Array(m);
	let mx = 0;
	let my = 0;
	for (let i = 0; i < m; i++) {
		xr[i] = sqrtD[i] * v[i];
		yr[i] = v[i] / sqrtD[i];
		mx = Math.max(mx, Math.abs(xr[i]));
		my = Math.max(my, Math.abs(yr[i]));
	}
	for (let i = 0; i < m; i++) {
		xr[i] /= mx;
		yr[i] /= my;
	}
	return { xr, xi: new Float64Array(m), yr, yi: new Float64Array(m) };
}

/** The port model's pole matrix D·H. */
export function poleMatrix(pm: PortModel): Float64Array {
	return scaleRows(pm.H, pm.d, pm.m);
}

/**
 * The zero matrix D·(H − h g / h0): the Rosenbrock pencil [[G + sC, b], [cᵀ, 0]] reduced to the
 * ports, at the same shift (see docs/methods.md). Valid when h0 = H(s0) ≠ 0.
 */
export function zeroMatrix(pm: PortModel): Float64Array {
	const m = pm.m;
	const a = new Float64Array(m * m);
	for (let i = 0; i < m; i++) {
		for (let j = 0; j < m; j++)
			a[i * m + j] = pm.d[i] * (pm.H[i * m + j] - (pm.h[i] * pm.g[j]) / pm.h0);
	}
	return a;
}
