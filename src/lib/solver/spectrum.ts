import { hessenberg, hqr, type Hessenberg } from './eigen';
import { eigenvectors, type EigenPair } from './eigenvectors';
import type { PortModel } from './port-model';

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
	hs: Hessenberg;
	/** Kept eigenvalues (finite s), with their μ. */
	s: { re: number; im: number; muRe: number; muIm: number }[];
	/** All μ, for the frequency-response solves. */
	mu: { re: Float64Array; im: Float64Array };
	s0: number;
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
	return eigenvectors(sp.hs, muRe, muIm);
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
