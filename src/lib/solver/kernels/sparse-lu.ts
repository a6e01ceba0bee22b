import { symmetricPattern, type Csc } from './csc';
import { minimumDegreeOrder } from './minimum-degree';

/**
 * Sparse LU with threshold partial pivoting, real or complex: P·A·Q = L·U.
 *
 * Left-looking by columns (Gilbert and Peierls, "Sparse partial pivoting in time proportional
 * to arithmetic operations", SIAM J. Sci. Stat. Comput. 9(5), 1988): column k of L and U is one
 * sparse triangular solve with the columns already computed, whose pattern is the set reachable
 * in the graph of L from A(:, k)'s rows (a depth-first search gives it in topological order), so
 * the work is proportional to the flops. Columns are taken in a minimum-degree order of A + Aᵀ
 * (minimum-degree.ts); a pivot is the diagonal row when its magnitude is at least `threshold`
 * times the column's largest (it keeps the fill the ordering planned for: nodal matrices are
 * close to diagonally dominant), else the largest — so zero diagonals (the branch rows of
 * modified nodal equations) are handled.
 *
 * Complex matrices (G + jωC) share the real code path with separate imaginary arrays: one file
 * instead of two copies of the same search and bookkeeping.
 */
export interface SparseLu {
	n: number;
	/** Column order: column k of the factors is column q[k] of A. */
	q: Int32Array;
	/** Row permutation: row i of A is row pinv[i] of the factors. */
	pinv: Int32Array;
	lp: Int32Array;
	li: Int32Array;
	lre: Float64Array;
	lim: Float64Array | null;
	up: Int32Array;
	ui: Int32Array;
	ure: Float64Array;
	uim: Float64Array | null;
	/** Smallest |pivot| over its column's largest entry of A: near 0 means (near) singular. */
	pivotRatio: number;
	singular: boolean;
}

/** A fill-reducing column order for a nonsymmetric pattern (minimum degree on A + Aᵀ). */
export function luOrder(a: Csc): Int32Array {
	const { ptr, adj } = symmetricPattern(a);
	return minimumDegreeOrder(a.n, ptr, adj);
}

class Grow {
	idx: Int32Array;
	re: Float64Array;
	im: Float64Array | null;
	size = 0;
	constructor(cap: number, complex: boolean) {
		this.idx = new Int32Array(cap);
		this.re = new Float64Array(cap);
		this.im = complex ? new Float64Array(cap) : null;
	}
	push(i: number, re: number, im: number): void {
		if (this.size === this.idx.length) {
			const cap = 2 * this.size + 16;
			const idx = new Int32Array(cap);
			idx.set(this.idx);
			this.idx = idx;
			const r = new Float64Array(cap);
			r.set(this.re);
			this.re = r;
			if (this.im) {
				const m = new Float64Array(cap);
				m.set(this.im);
				this.im = m;
			}
		}
		this.idx[this.size] = i;
		this.re[this.size] = re;
		if (this.im) this.im[this.size] = im;
		this.size++;
	}
}

/**
 * Factor A (pattern and real values in `a`; `im`, aligned with a.values, makes it complex).
 * `q` reuses a column order (a sweep over frequencies keeps one).
 */
export function sparseLu(
	a: Csc,
	im: Float64Array | null = null,
	q: Int32Array = luOrder(a),
	threshold = 0.1
): SparseLu {
	const n = a.n;
	const complex = im !== null;
	const nzA = a.colPtr[n];
	const L = new Grow(4 * nzA + n, complex);
	const U = new Grow(4 * nzA + n, complex);
	const lp = new Int32Array(n + 1);
	const up = new Int32Array(n + 1);
	const pinv = new Int32Array(n).fill(-1);
	const xr = new Float64Array(n);
	const xi = new Float64Array(n);
	const mark = new Int32Array(n).fill(-1);
	const pattern = new Int32Array(n);
	const stack = new Int32Array(n);
	const pstack = new Int32Array(n);
	let pivotRatio = n === 0 ? 1 : Infinity;
	let singular = false;
	for (let k = 0; k < n; k++) {
		lp[k] = L.size;
		up[k] = U.size;
		const col = q[k];
		// Pattern of x = L \ A(:, col): depth-first search from each row of the column.
		let top = n;
		let colMax = 0;
		for (let p = a.colPtr[col]; p < a.colPtr[col + 1]; p++) {
			const r = a.rowIdx[p];
			const mag = complex ? Math.hypot(a.values[p], im![p]) : Math.abs(a.values[p]);
			if (mag > colMax) colMax = mag;
			if (mark[r] === k) continue;
			top = reach(r, k, L.idx, lp, pinv, mark, stack, pstack, pattern, top);
		}
		for (let p = a.colPtr[col]; p < a.colPtr[col + 1]; p++) {
			xr[a.rowIdx[p]] += a.values[p];
			if (complex) xi[a.rowIdx[p]] += im![p];
		}
		// Triangular solve in topological order (L has unit diagonal stored first in each column).
		for (let t = top; t < n; t++) {
			const j = pattern[t];
			const J = pinv[j];
			if (J < 0) continue;
			const vr = xr[j];
			const vi = complex ? xi[j] : 0;
			if (vr === 0 && vi === 0) continue;
			const end = lp[J + 1];
			if (complex) {
				for (let p = lp[J] + 1; p < end; p++) {
					const r = L.idx[p];
					const cr = L.re[p];
					const ci = L.im![p];
					xr[r] -= cr * vr - ci * vi;
					xi[r] -= cr * vi + ci * vr;
				}
			} else for (let p = lp[J] + 1; p < end; p++) xr[L.idx[p]] -= L.re[p] * vr;
		}
		// Pivot: the diagonal row if large enough, else the largest unpivoted row.
		let best = -1;
		let bestMag = -1;
		for (let t = top; t < n; t++) {
			const r = pattern[t];
			if (pinv[r] >= 0) continue;
			const mag = complex ? Math.hypot(xr[r], xi[r]) : Math.abs(xr[r]);
			if (mag > bestMag) {
				bestMag = mag;
				best = r;
			}
		}
		if (pinv[col] < 0 && mark[col] === k) {
			const mag = complex ? Math.hypot(xr[col], xi[col]) : Math.abs(xr[col]);
			if (mag >= threshold * bestMag) {
				best = col;
				bestMag = mag;
			}
		}
		if (best < 0 || bestMag === 0) {
			singular = true;
			pivotRatio = 0;
			// Keep going with a unit pivot on an unpivoted row so the structure stays square.
			if (best < 0) for (best = 0; pinv[best] >= 0; best++);
			xr[best] = 1;
			xi[best] = 0;
			bestMag = 1;
		} else if (bestMag / Math.max(colMax, 1e-300) < pivotRatio)
			pivotRatio = bestMag / Math.max(colMax, 1e-300);
		const pr = xr[best];
		const pi = complex ? xi[best] : 0;
		// U(:, k): rows already pivoted, then the pivot last (so U's diagonal ends each column).
		for (let t = top; t < n; t++) {
			const r = pattern[t];
			if (pinv[r] >= 0) U.push(pinv[r], xr[r], xi[r]);
		}
		U.push(k, pr, pi);
		pinv[best] = k;
		L.push(best, 1, 0);
		const d2 = pr * pr + pi * pi;
		for (let t = top; t < n; t++) {
			const r = pattern[t];
			if (pinv[r] < 0) {
				if (complex) {
					const vr = xr[r];
					const vi = xi[r];
					L.push(r, (vr * pr + vi * pi) / d2, (vi * pr - vr * pi) / d2);
				} else L.push(r, xr[r] / pr, 0);
			}
			xr[r] = 0;
			xi[r] = 0;
		}
		xr[best] = 0;
		xi[best] = 0;
	}
	lp[n] = L.size;
	up[n] = U.size;
	// Rows of L in pivot order from now on.
	for (let p = 0; p < L.size; p++) L.idx[p] = pinv[L.idx[p]];
	return {
		n,
		q,
		pinv,
		lp,
		li: L.idx.slice(0, L.size),
		lre: L.re.slice(0, L.size),
		lim: L.im ? L.im.slice(0, L.size) : null,
		up,
		ui: U.idx.slice(0, U.size),
		ure: U.re.slice(0, U.size),
		uim: U.im ? U.im.slice(0, U.size) : null,
		pivotRatio: Number.isFinite(pivotRatio) ? pivotRatio : 0,
		singular
	};
}

/** Non-recursive depth-first search in the graph of L from row `start`; returns the new top. */
function reach(
	start: number,
	k: number,
	li: Int32Array,
	lp: Int32Array,
	pinv: Int32Array,
	mark: Int32Array,
	stack: Int32Array,
	pstack: Int32Array,
	out: Int32Array,
	top: number
): number {
	let head = 0;
	stack[0] = start;
	while (head >= 0) {
		const j = stack[head];
		const J = pinv[j];
		if (mark[j] !== k) {
			mark[j] = k;
			pstack[head] = J < 0 ? 0 : lp[J] + 1;
		}
		let done = true;
		if (J >= 0) {
			const end = lp[J + 1];
			for (let p = pstack[head]; p < end; p++) {
				const i = li[p];
				if (mark[i] === k) continue;
				pstack[head] = p + 1;
				stack[++head] = i;
				done = false;
				break;
			}
		}
		if (done) {
			head--;
			out[--top] = j;
		}
	}
	return top;
}

/** Solves A·x = b in place (real factors; b real). */
export function luSolveSparse(
	f: SparseLu,
	b: Float64Array,
	work = new Float64Array(f.n)
): Float64Array {
	const { n, pinv, q, lp, li, lre, up, ui, ure } = f;
	const y = work;
	for (let i = 0; i < n; i++) y[pinv[i]] = b[i];
	for (let j = 0; j < n; j++) {
		const v = y[j];
		if (v !== 0) for (let p = lp[j] + 1; p < lp[j + 1]; p++) y[li[p]] -= lre[p] * v;
	}
	for (let j = n - 1; j >= 0; j--) {
		const end = up[j + 1] - 1;
		const v = (y[j] /= ure[end]);
		if (v !== 0) for (let p = up[j]; p < end; p++) y[ui[p]] -= ure[p] * v;
	}
	for (let k = 0; k < n; k++) b[q[k]] = y[k];
	return b;
}

/** Solves Aᵀ·x = b in place (real factors): left vectors and adjoint functionals. */
export function luSolveSparseTransposed(
	f: SparseLu,
	b: Float64Array,
	work = new Float64Array(f.n)
): Float64Array {
	const { n, pinv, q, lp, li, lre, up, ui, ure } = f;
	const y = work;
	for (let k = 0; k < n; k++) y[k] = b[q[k]];
	// Uᵀ z = y (forward), then Lᵀ w = z (backward).
	for (let j = 0; j < n; j++) {
		const end = up[j + 1] - 1;
		let s = y[j];
		for (let p = up[j]; p < end; p++) s -= ure[p] * y[ui[p]];
		y[j] = s / ure[end];
	}
	for (let j = n - 1; j >= 0; j--) {
		let s = y[j];
		for (let p = lp[j] + 1; p < lp[j + 1]; p++) s -= lre[p] * y[li[p]];
		y[j] = s;
	}
	for (let i = 0; i < n; i++) b[i] = y[pinv[i]];
	return b;
}

/** Solves A·x = b in place with complex factors (br, bi real and imaginary parts). */
export function luSolveSparseComplex(f: SparseLu, br: Float64Array, bi: Float64Array): void {
	const { n, pinv, q, lp, li, lre, up, ui, ure } = f;
	const lim = f.lim ?? new Float64Array(lre.length);
	const uim = f.uim ?? new Float64Array(ure.length);
	const yr = new Float64Array(n);
	const yi = new Float64Array(n);
	for (let i = 0; i < n; i++) {
		yr[pinv[i]] = br[i];
		yi[pinv[i]] = bi[i];
	}
	for (let j = 0; j < n; j++) {
		const vr = yr[j];
		const vi = yi[j];
		if (vr === 0 && vi === 0) continue;
		for (let p = lp[j] + 1; p < lp[j + 1]; p++) {
			const r = li[p];
			yr[r] -= lre[p] * vr - lim[p] * vi;
			yi[r] -= lre[p] * vi + lim[p] * vr;
		}
	}
	for (let j = n - 1; j >= 0; j--) {
		const end = up[j + 1] - 1;
		const dr = ure[end];
		const di = uim[end];
		const d2 = dr * dr + di * di;
		const sr = yr[j];
		const si = yi[j];
		const vr = (sr * dr + si * di) / d2;
		const vi = (si * dr - sr * di) / d2;
		yr[j] = vr;
		yi[j] = vi;
		if (vr === 0 && vi === 0) continue;
		for (let p = up[j]; p < end; p++) {
			const r = ui[p];
			yr[r] -= ure[p] * vr - uim[p] * vi;
			yi[r] -= ure[p] * vi + uim[p] * vr;
		}
	}
	for (let k = 0; k < n; k++) {
		br[q[k]] = yr[k];
		bi[q[k]] = yi[k];
	}
}

/** Entries stored in L and U (a fill measure). */
export const luFill = (f: SparseLu) => f.li.length + f.ui.length;

/** Solves Aᵀ·x = b (transpose, not conjugate) in place with complex factors: left vectors. */
export function luSolveSparseComplexTransposed(
	f: SparseLu,
	br: Float64Array,
	bi: Float64Array
): void {
	const { n, pinv, q, lp, li, lre, up, ui, ure } = f;
	const lim = f.lim ?? new Float64Array(lre.length);
	const uim = f.uim ?? new Float64Array(ure.length);
	const yr = new Float64Array(n);
	const yi = new Float64Array(n);
	for (let k = 0; k < n; k++) {
		yr[k] = br[q[k]];
		yi[k] = bi[q[k]];
	}
	for (let j = 0; j < n; j++) {
		const end = up[j + 1] - 1;
		let sr = yr[j];
		let si = yi[j];
		for (let p = up[j]; p < end; p++) {
			const r = ui[p];
			sr -= ure[p] * yr[r] - uim[p] * yi[r];
			si -= ure[p] * yi[r] + uim[p] * yr[r];
		}
		const dr = ure[end];
		const di = uim[end];
		const d2 = dr * dr + di * di;
		yr[j] = (sr * dr + si * di) / d2;
		yi[j] = (si * dr - sr * di) / d2;
	}
	for (let j = n - 1; j >= 0; j--) {
		let sr = yr[j];
		let si = yi[j];
		for (let p = lp[j] + 1; p < lp[j + 1]; p++) {
			const r = li[p];
			sr -= lre[p] * yr[r] - lim[p] * yi[r];
			si -= lre[p] * yi[r] + lim[p] * yr[r];
		}
		yr[j] = sr;
		yi[j] = si;
	}
	for (let i = 0; i < n; i++) {
		br[i] = yr[pinv[i]];
		bi[i] = yi[pinv[i]];
	}
}
