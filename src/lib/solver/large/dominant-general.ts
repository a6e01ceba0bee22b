import { multiplyValues, norm1 } from '../kernels/csc';
import { largestMagnitudeEigenpairs } from '../kernels/arnoldi';
import {
	luOrder,
	luSolveSparse,
	luSolveSparseComplexTransposed,
	sparseLu,
	type SparseLu
} from '../kernels/sparse-lu';
import { INFINITE_MU } from '../spectrum';
import type { SparseMna } from './sparse-mna';

/**
 * The k natural frequencies nearest a real shift σ of any linear network (inductors, controlled
 * sources, op-amps), by implicitly restarted Arnoldi (kernels/arnoldi.ts) on the shift-and-invert
 * operator of the modified nodal pencil:
 *
 *     (G + σ·C)⁻¹·C·v = μ·v   ⇔   (G + s·C)·v = 0,   s = σ − 1/μ.
 *
 * The pencil's infinite eigenvalues (nodes without capacitance, capacitor loops, inductor cut
 * sets) are μ = 0 here and never among the largest. σ = 0 when G factors (the slowest poles);
 * otherwise a small positive rate, then a few multiples of it, as shift.ts does for the dense path.
 *
 * Each pole gets a left vector by one step of inverse iteration with the transposed pencil at a
 * point 1e-9 off the pole (one complex factorization per pole or conjugate pair), for the
 * residue and the participation; and the normwise backward error of its right vector.
 */
export interface GeneralPole {
	re: number;
	im: number;
	vr: Float64Array;
	vi: Float64Array;
	wr: Float64Array;
	wi: Float64Array;
	backwardError: number;
}

export interface GeneralDominant {
	poles: GeneralPole[];
	shift: number;
	converged: boolean;
	applications: number;
	factor: SparseLu;
	order: Int32Array;
}

export function generalDominantPoles(
	mna: SparseMna,
	k: number,
	shift: number | null,
	onProgress?: (converged: number) => void
): GeneralDominant | null {
	const { size: n, pattern, g, c } = mna;
	const order = luOrder(pattern);
	const picked = factorAtShift(mna, order, shift);
	if (!picked) return null;
	const { factor, sigma } = picked;
	const z = new Float64Array(n);
	const r = largestMagnitudeEigenpairs(
		n,
		(x, y) => {
			multiplyValues(pattern, c, x, z);
			y.set(z);
			luSolveSparse(factor, y);
		},
		{ k, onRestart: onProgress }
	);
	let muMax = 0;
	for (let i = 0; i < r.re.length; i++) muMax = Math.max(muMax, Math.hypot(r.re[i], r.im[i]));
	const gNorm = norm1(pattern, g);
	const cNorm = norm1(pattern, c);
	const poles: GeneralPole[] = [];
	let left: { wr: Float64Array; wi: Float64Array } | null = null;
	for (let i = 0; i < r.re.length; i++) {
		const a = r.re[i];
		const b = r.im[i];
		const m2 = a * a + b * b;
		if (!(Math.sqrt(m2) > INFINITE_MU * muMax)) continue;
		// Within a few ε·σ of the origin the pole is the origin (see dominant-rc.ts).
		const rawRe = sigma - a / m2;
		const im = b / m2;
		const re = im === 0 && Math.abs(rawRe) <= 1e-12 * sigma ? 0 : rawRe;
		// A conjugate pair shares its left vector (conjugated).
		const conjOfPrevious = poles.length > 0 && b !== 0 && poles[poles.length - 1].im === -im;
		if (!conjOfPrevious || !left) left = leftVector(mna, order, re, im);
		const wr = left.wr;
		const wi = conjOfPrevious ? left.wi.map((v) => -v) : left.wi;
		poles.push({
			re,
			im,
			vr: r.vr[i],
			vi: r.vi[i],
			wr,
			wi,
			backwardError: backwardError(mna, re, im, r.vr[i], r.vi[i], gNorm, cNorm)
		});
	}
	return {
		poles,
		shift: sigma,
		converged: r.converged,
		applications: r.applications,
		factor,
		order
	};
}

function factorAtShift(
	mna: SparseMna,
	order: Int32Array,
	shift: number | null
): { factor: SparseLu; sigma: number } | null {
	const { pattern, g, c } = mna;
	let gs = 0;
	let cs = 0;
	for (let j = 0; j < mna.size; j++)
		for (let p = pattern.colPtr[j]; p < pattern.colPtr[j + 1]; p++)
			if (pattern.rowIdx[p] === j) {
				gs += Math.abs(g[p]);
				cs += Math.abs(c[p]);
			}
	const rate = cs > 0 && gs > 0 ? (1e-6 * gs) / cs : 1;
	const tries =
		shift !== null
			? [shift]
			: [0, ...[1, 2.718281828, 0.3678794412, 7.389056099].map((f) => f * rate)];
	for (const sigma of tries) {
		const values = Float64Array.from(g, (v, i) => v + sigma * c[i]);
		const factor = sparseLu({ ...pattern, values }, null, order);
		if (!factor.singular && factor.pivotRatio > 1e-13) return { factor, sigma };
	}
	return null;
}

function leftVector(mna: SparseMna, order: Int32Array, re: number, im: number) {
	const { size: n, pattern, g, c } = mna;
	const off = 1e-9 * Math.max(Math.hypot(re, im), 1e-300);
	const sr = re + off;
	const values = Float64Array.from(g, (v, i) => v + sr * c[i]);
	const imag = Float64Array.from(c, (v) => im * v);
	const f = sparseLu({ ...pattern, values }, imag, order);
	const wr = new Float64Array(n).fill(1);
	const wi = new Float64Array(n);
	for (let step = 0; step < 2; step++) {
		luSolveSparseComplexTransposed(f, wr, wi);
		let s = 0;
		for (let i = 0; i < n; i++) s += wr[i] * wr[i] + wi[i] * wi[i];
		s = Math.sqrt(s) || 1;
		for (let i = 0; i < n; i++) {
			wr[i] /= s;
			wi[i] /= s;
		}
	}
	return { wr, wi };
}

function backwardError(
	mna: SparseMna,
	re: number,
	im: number,
	vr: Float64Array,
	vi: Float64Array,
	gNorm: number,
	cNorm: number
): number {
	const { size: n, pattern, g, c } = mna;
	const gr = multiplyValues(pattern, g, vr, new Float64Array(n));
	const gi = multiplyValues(pattern, g, vi, new Float64Array(n));
	const cr = multiplyValues(pattern, c, vr, new Float64Array(n));
	const ci = multiplyValues(pattern, c, vi, new Float64Array(n));
	let res = 0;
	let vv = 0;
	for (let j = 0; j < n; j++) {
		const er = gr[j] + re * cr[j] - im * ci[j];
		const ei = gi[j] + re * ci[j] + im * cr[j];
		res += er * er + ei * ei;
		vv += vr[j] * vr[j] + vi[j] * vi[j];
	}
	return Math.sqrt(res) / ((gNorm + Math.hypot(re, im) * cNorm) * Math.sqrt(vv));
}
