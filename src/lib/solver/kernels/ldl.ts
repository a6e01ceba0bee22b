import { permuteSymmetric, symmetricPattern, type Csc } from './csc';
import { minimumDegreeOrder } from './minimum-degree';

/**
 * Sparse LDLᵀ of a symmetric matrix (no pivoting): P·A·Pᵀ = L·D·Lᵀ with unit lower triangular L.
 *
 * Symbolic part: the fill-reducing order (minimum-degree.ts), the elimination tree (Liu, "The
 * role of elimination trees in sparse factorization", SIAM J. Matrix Anal. Appl. 11(1), 1990)
 * and the exact pattern of L, row by row from each row's subtree of the tree, in O(nnz(L)).
 * Numeric part: left-looking by columns (George and Liu, Computer Solution of Large Sparse
 * Positive Definite Systems, 1981): column k gathers the updates of the earlier columns whose
 * next row is k, kept in linked lists, so no search is needed.
 *
 * Accurate mode for diagonally dominant M-matrices (a conductance matrix: off-diagonals ≤ 0,
 * each row's sum is the conductance to the reference, known exactly). Each pivot is formed as
 * that row sum plus the magnitudes of the remaining off-diagonals, all non-negative, so nothing
 * cancels and the factors are accurate to a few ulps in every entry however ill-conditioned the
 * matrix (the row-sum parametrization of Alfa, Xue and Ye, "Accurate computation of the smallest
 * eigenvalue of a diagonally dominant M-matrix", Math. Comp. 71, 2002; the same idea as the
 * GTH algorithm for Markov chains). A 20,000-section ladder's slowest pole (condition ~10⁹)
 * keeps 1e-12 this way instead of losing eight digits.
 */
export interface LdlSymbolic {
	n: number;
	/** q[new] = old. */
	order: Int32Array;
	inverse: Int32Array;
	parent: Int32Array;
	colPtr: Int32Array;
	rowIdx: Int32Array;
	/** The permuted matrix, full symmetric pattern (its values are refilled per numeric call). */
	permuted: Csc;
	/** Position in `permuted` of each original entry (so new values of the same pattern map in). */
	map: Int32Array;
}

export interface Ldl {
	symbolic: LdlSymbolic;
	/** Off-diagonal values of L, aligned with symbolic.rowIdx. */
	lx: Float64Array;
	d: Float64Array;
	/** Smallest |pivot| relative to its row's diagonal: a cheap singularity indicator. */
	pivotRatio: number;
	accurate: boolean;
}

export function ldlSymbolic(a: Csc, order?: Int32Array): LdlSymbolic {
	const n = a.n;
	const q =
		order ??
		(() => {
			const { ptr, adj } = symmetricPattern(a);
			return minimumDegreeOrder(n, ptr, adj);
		})();
	const inverse = new Int32Array(n);
	for (let i = 0; i < n; i++) inverse[q[i]] = i;
	const permuted = permuteSymmetric(a, q);
	const map = positionsIn(a, permuted, inverse);
	const { colPtr: bp, rowIdx: bi } = permuted;
	// Elimination tree, with path compression through `ancestor`.
	const parent = new Int32Array(n).fill(-1);
	const ancestor = new Int32Array(n).fill(-1);
	for (let k = 0; k < n; k++)
		for (let p = bp[k]; p < bp[k + 1]; p++) {
			let i = bi[p];
			while (i !== -1 && i < k) {
				const up = ancestor[i];
				ancestor[i] = k;
				if (up === -1) parent[i] = k;
				i = up;
			}
		}
	// Row k of L is the union of the tree paths from each i < k with B(i, k) ≠ 0 up to k.
	const flag = new Int32Array(n).fill(-1);
	const counts = new Int32Array(n + 1);
	const walk = (visit: (j: number, k: number) => void) => {
		flag.fill(-1);
		for (let k = 0; k < n; k++) {
			flag[k] = k;
			for (let p = bp[k]; p < bp[k + 1]; p++)
				for (let i = bi[p]; i < k && flag[i] !== k; i = parent[i]) {
					flag[i] = k;
					visit(i, k);
				}
		}
	};
	walk((j) => counts[j + 1]++);
	for (let j = 0; j < n; j++) counts[j + 1] += counts[j];
	const colPtr = counts;
	const fillAt = colPtr.slice(0, n);
	const rowIdx = new Int32Array(colPtr[n]);
	// Rows arrive in increasing k: every column's row list comes out sorted.
	walk((j, k) => (rowIdx[fillAt[j]++] = k));
	return { n, order: q, inverse, parent, colPtr, rowIdx, permuted, map };
}

function positionsIn(a: Csc, b: Csc, inverse: Int32Array): Int32Array {
	const map = new Int32Array(a.colPtr[a.n]);
	for (let j = 0; j < a.n; j++) {
		const nj = inverse[j];
		for (let p = a.colPtr[j]; p < a.colPtr[j + 1]; p++) {
			const ni = inverse[a.rowIdx[p]];
			let lo = b.colPtr[nj];
			let hi = b.colPtr[nj + 1] - 1;
			while (lo < hi) {
				const mid = (lo + hi) >> 1;
				if (b.rowIdx[mid] < ni) lo = mid + 1;
				else hi = mid;
			}
			map[p] = lo;
		}
	}
	return map;
}

/** Refill the permuted copy with `values` (same pattern as the analysed matrix). */
export function permutedValues(s: LdlSymbolic, values: Float64Array): Float64Array {
	const out = new Float64Array(s.permuted.values.length);
	for (let p = 0; p < values.length; p++) out[s.map[p]] += values[p];
	return out;
}

/**
 * Numeric LDLᵀ. `excess` (original numbering) switches on the accurate M-matrix mode: it must be
 * each row's sum, computed without cancellation by the caller (for a conductance matrix, the
 * conductance from that node to the reference). The mode is refused (plain pivots used) when an
 * off-diagonal entry is positive or an excess is negative.
 */
export function ldlNumeric(s: LdlSymbolic, values: Float64Array, excess?: Float64Array): Ldl {
	const { n, colPtr, rowIdx, inverse } = s;
	const bp = s.permuted.colPtr;
	const bi = s.permuted.rowIdx;
	const bx = permutedValues(s, values);
	let accurate = !!excess;
	const sHat = new Float64Array(n);
	if (excess) {
		for (let i = 0; i < n; i++) {
			if (!(excess[i] >= 0)) accurate = false;
			sHat[inverse[i]] = excess[i];
		}
		for (let j = 0; j < n && accurate; j++)
			for (let p = bp[j]; p < bp[j + 1]; p++) if (bi[p] !== j && bx[p] > 0) accurate = false;
	}
	const lx = new Float64Array(rowIdx.length);
	const d = new Float64Array(n);
	const x = new Float64Array(n);
	const nextInCol = new Int32Array(n);
	const listHead = new Int32Array(n).fill(-1);
	const listNext = new Int32Array(n).fill(-1);
	let pivotRatio = n === 0 ? 1 : Infinity;
	for (let k = 0; k < n; k++) {
		let diag = 0;
		for (let p = bp[k]; p < bp[k + 1]; p++) {
			const r = bi[p];
			if (r > k) x[r] = bx[p];
			else if (r === k) diag = bx[p];
		}
		let dk = diag;
		let sk = sHat[k];
		// Columns i whose next pending row is k, in a linked list threaded through listNext.
		let i = listHead[k];
		while (i !== -1) {
			const following = listNext[i];
			const p = nextInCol[i];
			const lki = lx[p];
			const f = lki * d[i];
			dk -= lki * f;
			if (accurate) sk += Math.abs(lki) * sHat[i];
			for (let q = p + 1; q < colPtr[i + 1]; q++) x[rowIdx[q]] -= lx[q] * f;
			if (p + 1 < colPtr[i + 1]) {
				nextInCol[i] = p + 1;
				const r = rowIdx[p + 1];
				listNext[i] = listHead[r];
				listHead[r] = i;
			}
			i = following;
		}
		if (accurate) {
			let off = 0;
			for (let q = colPtr[k]; q < colPtr[k + 1]; q++) off -= x[rowIdx[q]];
			dk = sk + off;
			sHat[k] = sk;
		}
		d[k] = dk;
		const ratio = Math.abs(dk) / Math.max(Math.abs(diag), 1e-300);
		if (ratio < pivotRatio) pivotRatio = ratio;
		const inv = dk !== 0 ? 1 / dk : 0;
		for (let q = colPtr[k]; q < colPtr[k + 1]; q++) {
			const r = rowIdx[q];
			lx[q] = x[r] * inv;
			x[r] = 0;
		}
		if (colPtr[k] < colPtr[k + 1]) {
			nextInCol[k] = colPtr[k];
			const r = rowIdx[colPtr[k]];
			listNext[k] = listHead[r];
			listHead[r] = k;
		}
	}
	if (!Number.isFinite(pivotRatio)) pivotRatio = 0;
	return { symbolic: s, lx, d, pivotRatio, accurate };
}

/** Analyse and factor in one call (the order is computed from A's pattern). */
export function ldl(a: Csc, excess?: Float64Array): Ldl {
	return ldlNumeric(ldlSymbolic(a), a.values, excess);
}

/** Solves A·x = b in place (original numbering); `work` avoids an allocation per call. */
export function ldlSolve(
	f: Ldl,
	b: Float64Array,
	work = new Float64Array(f.symbolic.n)
): Float64Array {
	const { n, order, colPtr, rowIdx } = f.symbolic;
	const { lx, d } = f;
	const y = work;
	for (let i = 0; i < n; i++) y[i] = b[order[i]];
	for (let j = 0; j < n; j++) {
		const yj = y[j];
		if (yj !== 0) for (let p = colPtr[j]; p < colPtr[j + 1]; p++) y[rowIdx[p]] -= lx[p] * yj;
	}
	for (let j = 0; j < n; j++) y[j] /= d[j];
	for (let j = n - 1; j >= 0; j--) {
		let s = y[j];
		for (let p = colPtr[j]; p < colPtr[j + 1]; p++) s -= lx[p] * y[rowIdx[p]];
		y[j] = s;
	}
	for (let i = 0; i < n; i++) b[order[i]] = y[i];
	return b;
}

/** Number of stored entries of L (off-diagonal), for reports and memory estimates. */
export const ldlFill = (f: Ldl) => f.lx.length;

/**
 * The two halves of A⁻¹ = Pᵀ·L⁻ᵀ·D^-½ · D^-½·L⁻¹·P for a positive definite A, so that
 * R⁻¹·M·R⁻ᵀ (A = R·Rᵀ, R = Pᵀ·L·D^½) can be applied as a symmetric operator — the
 * shift-and-invert form of a symmetric definite pencil (lanczos.ts). `half` works in the
 * permuted numbering: forward takes an original-numbered vector to it, backward returns.
 */
export function ldlHalfForward(f: Ldl, b: Float64Array, out: Float64Array): Float64Array {
	const { n, order, colPtr, rowIdx } = f.symbolic;
	const { lx, d } = f;
	for (let i = 0; i < n; i++) out[i] = b[order[i]];
	for (let j = 0; j < n; j++) {
		const yj = out[j];
		if (yj !== 0) for (let p = colPtr[j]; p < colPtr[j + 1]; p++) out[rowIdx[p]] -= lx[p] * yj;
	}
	for (let j = 0; j < n; j++) out[j] /= Math.sqrt(d[j]);
	return out;
}

export function ldlHalfBackward(f: Ldl, w: Float64Array, out: Float64Array): Float64Array {
	const { n, order, colPtr, rowIdx } = f.symbolic;
	const { lx, d } = f;
	const y = halfWork(f, n);
	for (let j = 0; j < n; j++) y[j] = w[j] / Math.sqrt(d[j]);
	for (let j = n - 1; j >= 0; j--) {
		let s = y[j];
		for (let p = colPtr[j]; p < colPtr[j + 1]; p++) s -= lx[p] * y[rowIdx[p]];
		y[j] = s;
	}
	for (let i = 0; i < n; i++) out[order[i]] = y[i];
	return out;
}

const halfWorks = new WeakMap<Ldl, Float64Array>();
function halfWork(f: Ldl, n: number): Float64Array {
	let w = halfWorks.get(f);
	if (!w) halfWorks.set(f, (w = new Float64Array(n)));
	return w;
}

/**
 * Complex symmetric LDLᵀ (A = Aᵀ, not Hermitian) on the same symbolic analysis: the network
 * G + jω·C of a reciprocal network at one frequency. Without pivoting, as for the real factor:
 * the real part G is positive definite, so no pivot vanishes.
 */
export interface LdlComplex {
	symbolic: LdlSymbolic;
	lre: Float64Array;
	lim: Float64Array;
	dre: Float64Array;
	dim: Float64Array;
}

export function ldlNumericComplex(s: LdlSymbolic, re: Float64Array, im: Float64Array): LdlComplex {
	const { n, colPtr, rowIdx } = s;
	const bp = s.permuted.colPtr;
	const bi = s.permuted.rowIdx;
	const br = permutedValues(s, re);
	const bim = permutedValues(s, im);
	const lre = new Float64Array(rowIdx.length);
	const lim = new Float64Array(rowIdx.length);
	const dre = new Float64Array(n);
	const dim = new Float64Array(n);
	const xr = new Float64Array(n);
	const xi = new Float64Array(n);
	const nextInCol = new Int32Array(n);
	const listHead = new Int32Array(n).fill(-1);
	const listNext = new Int32Array(n).fill(-1);
	for (let k = 0; k < n; k++) {
		let dr = 0;
		let di = 0;
		for (let p = bp[k]; p < bp[k + 1]; p++) {
			const r = bi[p];
			if (r > k) {
				xr[r] = br[p];
				xi[r] = bim[p];
			} else if (r === k) {
				dr = br[p];
				di = bim[p];
			}
		}
		let i = listHead[k];
		while (i !== -1) {
			const following = listNext[i];
			const p = nextInCol[i];
			const ar = lre[p];
			const ai = lim[p];
			// f = l_ki · d_i
			const fr = ar * dre[i] - ai * dim[i];
			const fi = ar * dim[i] + ai * dre[i];
			dr -= ar * fr - ai * fi;
			di -= ar * fi + ai * fr;
			for (let q = p + 1; q < colPtr[i + 1]; q++) {
				const r = rowIdx[q];
				xr[r] -= lre[q] * fr - lim[q] * fi;
				xi[r] -= lre[q] * fi + lim[q] * fr;
			}
			if (p + 1 < colPtr[i + 1]) {
				nextInCol[i] = p + 1;
				const r = rowIdx[p + 1];
				listNext[i] = listHead[r];
				listHead[r] = i;
			}
			i = following;
		}
		dre[k] = dr;
		dim[k] = di;
		const d2 = dr * dr + di * di;
		const ir = d2 > 0 ? dr / d2 : 0;
		const ii = d2 > 0 ? -di / d2 : 0;
		for (let q = colPtr[k]; q < colPtr[k + 1]; q++) {
			const r = rowIdx[q];
			lre[q] = xr[r] * ir - xi[r] * ii;
			lim[q] = xr[r] * ii + xi[r] * ir;
			xr[r] = 0;
			xi[r] = 0;
		}
		if (colPtr[k] < colPtr[k + 1]) {
			nextInCol[k] = colPtr[k];
			const r = rowIdx[colPtr[k]];
			listNext[k] = listHead[r];
			listHead[r] = k;
		}
	}
	return { symbolic: s, lre, lim, dre, dim };
}

/** Solves A·x = b in place with a complex LDLᵀ (original numbering). */
export function ldlSolveComplex(f: LdlComplex, br: Float64Array, bi: Float64Array): void {
	const { n, order, colPtr, rowIdx } = f.symbolic;
	const { lre, lim, dre, dim } = f;
	const yr = new Float64Array(n);
	const yi = new Float64Array(n);
	for (let i = 0; i < n; i++) {
		yr[i] = br[order[i]];
		yi[i] = bi[order[i]];
	}
	for (let j = 0; j < n; j++) {
		const vr = yr[j];
		const vi = yi[j];
		if (vr === 0 && vi === 0) continue;
		for (let p = colPtr[j]; p < colPtr[j + 1]; p++) {
			const r = rowIdx[p];
			yr[r] -= lre[p] * vr - lim[p] * vi;
			yi[r] -= lre[p] * vi + lim[p] * vr;
		}
	}
	for (let j = 0; j < n; j++) {
		const d2 = dre[j] * dre[j] + dim[j] * dim[j];
		const vr = yr[j];
		const vi = yi[j];
		yr[j] = (vr * dre[j] + vi * dim[j]) / d2;
		yi[j] = (vi * dre[j] - vr * dim[j]) / d2;
	}
	for (let j = n - 1; j >= 0; j--) {
		let sr = yr[j];
		let si = yi[j];
		for (let p = colPtr[j]; p < colPtr[j + 1]; p++) {
			const r = rowIdx[p];
			sr -= lre[p] * yr[r] - lim[p] * yi[r];
			si -= lre[p] * yi[r] + lim[p] * yr[r];
		}
		yr[j] = sr;
		yi[j] = si;
	}
	for (let i = 0; i < n; i++) {
		br[order[i]] = yr[i];
		bi[order[i]] = yi[i];
	}
}
