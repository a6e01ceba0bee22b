/**
 * Banded complex LU with partial pivoting (the unblocked band elimination of LAPACK's zgbtf2:
 * Anderson et al., LAPACK Users' Guide, 3rd ed., SIAM 1999), and solves whose results carry a
 * binary exponent per entry so that values far outside 1e±308 neither underflow nor overflow.
 *
 * Storage: row i keeps the columns i − kl … i + kl + ku (width W = 2·kl + ku + 1) at
 * i·W + (j − i + kl). Row interchanges within a column move at most kl + ku + 1 entries, and
 * the fill of pivoting stays inside the window (U gains kl superdiagonals). The multipliers of
 * column k live in `mr/mi` at k·kl + (i − k − 1); as in zgbtf2, earlier columns of L are not
 * permuted, so L is applied as the product of its elementary steps. Cost: n·kl·(2kl + ku)
 * multiply-adds to factor, n·(2kl + ku) to solve — linear in n for a fixed bandwidth.
 */
export interface BandLU {
	n: number;
	kl: number;
	ku: number;
	w: number;
	re: Float64Array;
	im: Float64Array;
	mr: Float64Array;
	mi: Float64Array;
	piv: Int32Array;
	/** An exactly zero pivot: the matrix is singular (at this frequency). */
	singular: boolean;
}

export function bandWorkspace(n: number, kl: number, ku: number): BandLU {
	const w = 2 * kl + ku + 1;
	return {
		n,
		kl,
		ku,
		w,
		re: new Float64Array(n * w),
		im: new Float64Array(n * w),
		mr: new Float64Array(Math.max(1, n * kl)),
		mi: new Float64Array(Math.max(1, n * kl)),
		piv: new Int32Array(n),
		singular: false
	};
}

/** Index of entry (i, j) in the band storage; the caller keeps j within the window. */
export const bandIndex = (f: BandLU, i: number, j: number) => i * f.w + (j - i + f.kl);

/** Factors in place what the caller stored in f.re / f.im (the rest of each window zero). */
export function bandFactor(f: BandLU): void {
	const { n, kl, ku, w, re, im, mr, mi, piv } = f;
	f.singular = false;
	for (let k = 0; k < n; k++) {
		const last = Math.min(n - 1, k + kl);
		let p = k;
		let best = Math.abs(re[k * w + kl]) + Math.abs(im[k * w + kl]);
		for (let i = k + 1; i <= last; i++) {
			const at = i * w + (k - i + kl);
			const v = Math.abs(re[at]) + Math.abs(im[at]);
			if (v > best) {
				best = v;
				p = i;
			}
		}
		piv[k] = p;
		const jEnd = Math.min(n - 1, k + kl + ku);
		if (p !== k) {
			for (let j = k; j <= jEnd; j++) {
				const a = k * w + (j - k + kl);
				const b = p * w + (j - p + kl);
				let t = re[a];
				re[a] = re[b];
				re[b] = t;
				t = im[a];
				im[a] = im[b];
				im[b] = t;
			}
		}
		const dr = re[k * w + kl];
		const di = im[k * w + kl];
		// 1/d scaled first, so a pivot near 1e±160 does not under- or overflow |d|².
		const sd = Math.abs(dr) + Math.abs(di);
		const d2 = sd > 0 ? (dr / sd) * (dr / sd) + (di / sd) * (di / sd) : 0;
		if (d2 === 0 || !Number.isFinite(sd)) {
			f.singular = true;
			for (let i = k + 1; i <= last; i++) mr[k * kl + (i - k - 1)] = mi[k * kl + (i - k - 1)] = 0;
			continue;
		}
		const ir = dr / sd / sd / d2;
		const ii = -di / sd / sd / d2;
		for (let i = k + 1; i <= last; i++) {
			const at = i * w + (k - i + kl);
			const ar = re[at];
			const ai = im[at];
			const slot = k * kl + (i - k - 1);
			if (ar === 0 && ai === 0) {
				mr[slot] = 0;
				mi[slot] = 0;
				continue;
			}
			const fr = ar * ir - ai * ii;
			const fi = ar * ii + ai * ir;
			mr[slot] = fr;
			mi[slot] = fi;
			re[at] = 0;
			im[at] = 0;
			const rowI = i * w - i + kl;
			const rowK = k * w - k + kl;
			for (let j = k + 1; j <= jEnd; j++) {
				const br = re[rowK + j];
				const bi = im[rowK + j];
				if (br === 0 && bi === 0) continue;
				re[rowI + j] -= fr * br - fi * bi;
				im[rowI + j] -= fr * bi + fi * br;
			}
		}
	}
}

/**
 * A complex vector whose entry i is (re[i] + j·im[i])·2^ex[i]. Mantissas are renormalized only
 * when they leave 2^±400, so ordinary values cost one comparison per operation.
 */
export interface WideVector {
	re: Float64Array;
	im: Float64Array;
	ex: Int32Array;
}

export function wideVector(n: number): WideVector {
	return { re: new Float64Array(n), im: new Float64Array(n), ex: new Int32Array(n) };
}

const BIG = 2 ** 400;
const SMALL = 2 ** -400;

function renorm(v: WideVector, i: number): void {
	const m = Math.max(Math.abs(v.re[i]), Math.abs(v.im[i]));
	if (m === 0) {
		v.ex[i] = 0;
		return;
	}
	if (m < BIG && m > SMALL) return;
	const e = Math.floor(Math.log2(m));
	const s = 2 ** -e;
	v.re[i] *= s;
	v.im[i] *= s;
	v.ex[i] += e;
}

/** 2^k as a double, 0 below the range (the term is then negligible by ≥ 2^-1000). */
const pow2 = (k: number) => (k < -1000 ? 0 : 2 ** k);

/** v[i] ← v[i] − (ar + j·ai)·v[k] (a = a matrix entry of ordinary size). */
function subScaled(v: WideVector, i: number, ar: number, ai: number, k: number): void {
	const xr = v.re[k];
	const xi = v.im[k];
	if (xr === 0 && xi === 0) return;
	const tr = ar * xr - ai * xi;
	const ti = ar * xi + ai * xr;
	const ek = v.ex[k];
	const ei = v.ex[i];
	if (v.re[i] === 0 && v.im[i] === 0) {
		v.re[i] = -tr;
		v.im[i] = -ti;
		v.ex[i] = ek;
		renorm(v, i);
		return;
	}
	if (ek === ei) {
		v.re[i] -= tr;
		v.im[i] -= ti;
	} else if (ek < ei) {
		const s = pow2(ek - ei);
		v.re[i] -= tr * s;
		v.im[i] -= ti * s;
	} else {
		const s = pow2(ei - ek);
		v.re[i] = v.re[i] * s - tr;
		v.im[i] = v.im[i] * s - ti;
		v.ex[i] = ek;
	}
	renorm(v, i);
}

/** Solves A·x = b in place (b given as a WideVector with the factor's ordering). */
export function bandSolve(f: BandLU, b: WideVector): void {
	const { n, kl, w, re, im, mr, mi, piv } = f;
	for (let k = 0; k < n; k++) {
		const p = piv[k];
		if (p !== k) {
			let t = b.re[k];
			b.re[k] = b.re[p];
			b.re[p] = t;
			t = b.im[k];
			b.im[k] = b.im[p];
			b.im[p] = t;
			const e = b.ex[k];
			b.ex[k] = b.ex[p];
			b.ex[p] = e;
		}
		const last = Math.min(n - 1, k + kl);
		for (let i = k + 1; i <= last; i++) {
			const slot = k * kl + (i - k - 1);
			if (mr[slot] !== 0 || mi[slot] !== 0) subScaled(b, i, mr[slot], mi[slot], k);
		}
	}
	for (let i = n - 1; i >= 0; i--) {
		const row = i * w - i + kl;
		const jEnd = Math.min(n - 1, i + f.kl + f.ku);
		for (let j = i + 1; j <= jEnd; j++) {
			const ur = re[row + j];
			const ui = im[row + j];
			if (ur !== 0 || ui !== 0) subScaled(b, i, ur, ui, j);
		}
		const sd = Math.abs(re[row + i]) + Math.abs(im[row + i]);
		const dr = re[row + i] / sd;
		const di = im[row + i] / sd;
		const d2 = dr * dr + di * di;
		const xr = b.re[i];
		const xi = b.im[i];
		b.re[i] = (xr * dr + xi * di) / d2 / sd;
		b.im[i] = (xi * dr - xr * di) / d2 / sd;
		renorm(b, i);
	}
}

/**
 * The same solve in plain doubles, for the common case where nothing leaves the double range:
 * returns false (and leaves b unusable) as soon as an entry of the solution falls outside
 * 1e±280, so the caller repeats the solve with a WideVector. Several times faster than bandSolve.
 */
export function bandSolvePlain(f: BandLU, br: Float64Array, bi: Float64Array): boolean {
	const { n, kl, w, re, im, mr, mi, piv } = f;
	for (let k = 0; k < n; k++) {
		const p = piv[k];
		if (p !== k) {
			let t = br[k];
			br[k] = br[p];
			br[p] = t;
			t = bi[k];
			bi[k] = bi[p];
			bi[p] = t;
		}
		const xr = br[k];
		const xi = bi[k];
		if (xr === 0 && xi === 0) continue;
		const last = Math.min(n - 1, k + kl);
		for (let i = k + 1; i <= last; i++) {
			const slot = k * kl + (i - k - 1);
			const ar = mr[slot];
			const ai = mi[slot];
			br[i] -= ar * xr - ai * xi;
			bi[i] -= ar * xi + ai * xr;
		}
	}
	for (let i = n - 1; i >= 0; i--) {
		const row = i * w - i + kl;
		const jEnd = Math.min(n - 1, i + f.kl + f.ku);
		let sr = br[i];
		let si = bi[i];
		for (let j = i + 1; j <= jEnd; j++) {
			const ur = re[row + j];
			const ui = im[row + j];
			sr -= ur * br[j] - ui * bi[j];
			si -= ur * bi[j] + ui * br[j];
		}
		const sd = Math.abs(re[row + i]) + Math.abs(im[row + i]);
		const dr = re[row + i] / sd;
		const di = im[row + i] / sd;
		const d2 = dr * dr + di * di;
		const xr = (sr * dr + si * di) / d2 / sd;
		const xi = (si * dr - sr * di) / d2 / sd;
		const m = Math.abs(xr) + Math.abs(xi);
		if (m !== 0 && !(m > 1e-280 && m < 1e280)) return false;
		br[i] = xr;
		bi[i] = xi;
	}
	return true;
}
