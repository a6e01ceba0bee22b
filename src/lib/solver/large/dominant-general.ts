import { multiplyValues, norm1 } from '../kernels/csc';
import { largestMagnitudeEigenpairs } from '../kernels/arnoldi';
import {
	luOrder,
	luSolveSparse,
	luSolveSparseComplex,
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
	let left: ReturnType<typeof refinedPair> | null = null;
	for (let i = 0; i < r.re.length; i++) {
		const a = r.re[i];
		const b = r.im[i];
		const m2 = a * a + b * b;
		if (!(Math.sqrt(m2) > INFINITE_MU * muMax)) continue;
		// Within a few ε·σ of the origin the pole is the origin (see dominant-rc.ts).
		const rawRe = sigma - a / m2;
		const ritzIm = b / m2;
		const ritzRe = ritzIm === 0 && Math.abs(rawRe) <= 1e-12 * sigma ? 0 : rawRe;
		// A conjugate pair shares its left vector and refinement (conjugated).
		const prev = poles[poles.length - 1];
		const conjOfPrevious = poles.length > 0 && b !== 0 && prev.im === -ritzIm;
		if (!conjOfPrevious || !left) left = refinedPair(mna, order, ritzRe, ritzIm, r.vr[i], r.vi[i]);
		const flip = conjOfPrevious ? -1 : 1;
		const wr = left.wr;
		const wi = conjOfPrevious ? left.wi.map((v) => -v) : left.wi;
		// The refined pair where it is better than the Ritz pair (its backward error), else the
		// Ritz pair: on a non-normal pencil a residual of 1e-10 left a pole 1e-7 off.
		const ritzError = backwardError(mna, ritzRe, ritzIm, r.vr[i], r.vi[i], gNorm, cNorm);
		const refined = left.refined;
		const refinedError = refined
			? backwardError(mna, refined.re, flip * refined.im, refined.vr, refined.vi.map((v: number) => flip * v), gNorm, cNorm)
			: Infinity;
		const useRefined = refined !== null && refinedError < ritzError;
		const re = useRefined ? refined.re : ritzRe;
		const im = useRefined ? flip * refined.im : ritzIm;
		poles.push({
			re,
			im: ritzIm === 0 ? 0 : im,
			vr: useRefined ? refined.vr : r.vr[i],
			vi: useRefined ? refined.vi.map((v: number) => flip * v) : r.vi[i],
			wr,
			wi,
			backwardError: useRefined ? refinedError : ritzError
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

/**
 * The left vector of a pole by inverse iteration on the transposed pencil near it, and the pole
 * refined with it: the right vector by two steps of inverse iteration from the Ritz vector with
 * the same factors, then the two-sided Rayleigh quotient λ = −(wᵀ·G·v)/(wᵀ·C·v), whose error is
 * the product of the two vectors' errors (Ostrowski; Parlett, "The Rayleigh quotient iteration
 * and some generalizations for nonnormal matrices", Math. Comp. 28, 1974).
 */
function refinedPair(
	mna: SparseMna,
	order: Int32Array,
	re: number,
	im: number,
	xr: Float64Array,
	xi: Float64Array
) {
	const { size: n, pattern, g, c } = mna;
	const off = 1e-9 * Math.max(Math.hypot(re, im), 1e-300);
	const sr = re + off;
	const values = Float64Array.from(g, (v, i) => v + sr * c[i]);
	const imag = Float64Array.from(c, (v) => im * v);
	const f = sparseLu({ ...pattern, values }, imag, order);
	const normalize = (ar: Float64Array, ai: Float64Array) => {
		let s = 0;
		for (let i = 0; i < n; i++) s += ar[i] * ar[i] + ai[i] * ai[i];
		s = Math.sqrt(s) || 1;
		for (let i = 0; i < n; i++) {
			ar[i] /= s;
			ai[i] /= s;
		}
	};
	const wr = new Float64Array(n).fill(1);
	const wi = new Float64Array(n);
	for (let step = 0; step < 2; step++) {
		luSolveSparseComplexTransposed(f, wr, wi);
		normalize(wr, wi);
	}
	if (f.singular) return { wr, wi, refined: null };
	let vr: Float64Array = Float64Array.from(xr);
	let vi: Float64Array = Float64Array.from(xi);
	for (let step = 0; step < 2; step++) {
		const yr = multiplyValues(pattern, c, vr, new Float64Array(n));
		const yi = multiplyValues(pattern, c, vi, new Float64Array(n));
		luSolveSparseComplex(f, yr, yi);
		normalize(yr, yi);
		[vr, vi] = [yr, yi];
	}
	// wᵀ·M·v for M = G and C (transposed, not conjugated: w is a left vector of the pencil).
	const form = (values: Float64Array) => {
		const mr = multiplyValues(pattern, values, vr, new Float64Array(n));
		const mi = multiplyValues(pattern, values, vi, new Float64Array(n));
		let pr = 0;
		let pi = 0;
		for (let j = 0; j < n; j++) {
			pr += wr[j] * mr[j] - wi[j] * mi[j];
			pi += wr[j] * mi[j] + wi[j] * mr[j];
		}
		return [pr, pi];
	};
	const [gr, gi] = form(g);
	const [cr, ci] = form(c);
	const d = cr * cr + ci * ci;
	if (!(d > 0)) return { wr, wi, refined: null };
	const lr = -(gr * cr + gi * ci) / d;
	const li = -(gi * cr - gr * ci) / d;
	if (!Number.isFinite(lr) || !Number.isFinite(li)) return { wr, wi, refined: null };
	return { wr, wi, refined: { re: lr, im: im === 0 ? 0 : li, vr, vi } };
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
