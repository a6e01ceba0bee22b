/**
 * Householder QR with column pivoting of a tall m×n matrix X (Golub & Van Loan, Matrix
 * Computations, 4th ed., §5.4.2 "QR with column pivoting"): X·Π = Q·R with Q orthogonal (kept as
 * its reflectors), R upper trapezoidal with non-increasing |r_kk|. The factorization stops at
 * the numerical rank r, where every remaining column has norm at most tol: then the first r
 * columns of Q are an orthonormal basis of range(X) and X = Q₁·R₁·Πᵀ up to those neglected
 * columns, a backward error of at most tol·√n in X.
 *
 * Columns are stored contiguously (column-major input), so each reflection sweeps memory in
 * order. Column norms are downdated after each step and recomputed when cancellation has eaten
 * their digits (the safeguard of LAPACK's xLAQP2: Drmač & Bujanović, LAPACK Working Note 176).
 */
export interface PivotedQR {
	m: number;
	n: number;
	/** Numerical rank: the number of reflections taken. */
	rank: number;
	/** Π as a list: column k of X·Π is column perm[k] of X. */
	perm: Int32Array;
	/** Row k of R₁ (k < rank), entries for pivoted columns k … n − 1, at r[k·n + j]. */
	r: Float64Array;
	/** Reflector k: I − τ_k·v_k·v_kᵀ, with v_k in rows k … m − 1 of column k of `v` (m×rank). */
	v: Float64Array;
	tau: Float64Array;
}

/**
 * `x`: column-major m×n (column j at x[j·m … j·m + m − 1]), overwritten. `tol`: a column whose
 * remaining norm is at most this counts as dependent on the ones already taken.
 */
export function pivotedQR(x: Float64Array, m: number, n: number, tol: number): PivotedQR {
	const kmax = Math.min(m, n);
	const perm = Int32Array.from({ length: n }, (_, j) => j);
	const norms = new Float64Array(n);
	const start = new Float64Array(n);
	for (let j = 0; j < n; j++) {
		norms[j] = colNorm(x, j * m, 0, m);
		start[j] = norms[j];
	}
	const v = new Float64Array(m * kmax);
	const tau = new Float64Array(kmax);
	const r = new Float64Array(kmax * n);
	const tol3z = Math.sqrt(Number.EPSILON);
	const at = new Int32Array(m);
	const val = new Float64Array(m);
	let k = 0;
	for (; k < kmax; k++) {
		let best = k;
		for (let j = k + 1; j < n; j++) if (norms[j] > norms[best]) best = j;
		if (!(norms[best] > tol)) break;
		if (best !== k) {
			swapColumns(x, k * m, best * m, m);
			[perm[k], perm[best]] = [perm[best], perm[k]];
			[norms[k], norms[best]] = [norms[best], norms[k]];
			[start[k], start[best]] = [start[best], start[k]];
			for (let i = 0; i < k; i++) [r[i * n + k], r[i * n + best]] = [r[i * n + best], r[i * n + k]];
		}
		// Reflection taking x[k…m−1, k] to alpha·e_k, alpha of the opposite sign to x_kk.
		const ck = k * m;
		const norm = colNorm(x, ck, k, m);
		const alpha = x[ck + k] > 0 ? -norm : norm;
		const vk = k * m;
		for (let i = k; i < m; i++) v[vk + i] = x[ck + i];
		v[vk + k] -= alpha;
		let vv = 0;
		for (let i = k; i < m; i++) vv += v[vk + i] * v[vk + i];
		tau[k] = vv > 0 ? 2 / vv : 0;
		r[k * n + k] = alpha;
		// The reflector's non-zero rows (a sparse X gives sparse reflectors).
		let nz = 0;
		for (let i = k; i < m; i++) {
			if (v[vk + i] !== 0) {
				at[nz] = i;
				val[nz++] = v[vk + i];
			}
		}
		for (let j = k + 1; j < n; j++) {
			const cj = j * m;
			let s = 0;
			for (let q = 0; q < nz; q++) s += val[q] * x[cj + at[q]];
			s *= tau[k];
			if (s !== 0) for (let q = 0; q < nz; q++) x[cj + at[q]] -= s * val[q];
			const rkj = x[cj + k];
			r[k * n + j] = rkj;
			// Downdate the remaining norm of column j (rows k + 1 … m − 1).
			if (norms[j] !== 0) {
				const t = Math.max(0, 1 - (rkj / norms[j]) ** 2);
				const t2 = t * (norms[j] / start[j]) ** 2;
				if (t2 <= tol3z) {
					norms[j] = colNorm(x, cj, k + 1, m);
					start[j] = norms[j];
				} else norms[j] *= Math.sqrt(t);
			}
		}
	}
	return { m, n, rank: k, perm, r, v, tau };
}

/** Qᵀ·y in place (y of length m): its first `rank` entries are the coordinates on range(X). */
export function applyQt(qr: PivotedQR, y: Float64Array): Float64Array {
	for (let k = 0; k < qr.rank; k++) reflect(qr, k, y);
	return y;
}

/** Q·y in place. */
export function applyQ(qr: PivotedQR, y: Float64Array): Float64Array {
	for (let k = qr.rank - 1; k >= 0; k--) reflect(qr, k, y);
	return y;
}

/**
 * Q·y for each of `count` rows y of `rows` (row-major, length m each), in place. The reflectors
 * of a sparse X stay fairly sparse (about a third of their entries are non-zero on a capacitor
 * mesh), so each is gathered to its non-zero rows once and applied to every row of `rows`.
 */
export function applyQToRows(qr: PivotedQR, rows: Float64Array, count: number): Float64Array {
	const { m, v, tau } = qr;
	const at = new Int32Array(m);
	const val = new Float64Array(m);
	for (let k = qr.rank - 1; k >= 0; k--) {
		const vk = k * m;
		let nz = 0;
		for (let i = k; i < m; i++) {
			if (v[vk + i] !== 0) {
				at[nz] = i;
				val[nz++] = v[vk + i];
			}
		}
		const t = tau[k];
		for (let row = 0; row < count; row++) {
			const o = row * m;
			let s = 0;
			for (let q = 0; q < nz; q++) s += val[q] * rows[o + at[q]];
			s *= t;
			if (s !== 0) for (let q = 0; q < nz; q++) rows[o + at[q]] -= s * val[q];
		}
	}
	return rows;
}

function reflect(qr: PivotedQR, k: number, y: Float64Array): void {
	const { m, v, tau } = qr;
	const vk = k * m;
	let s = 0;
	for (let i = k; i < m; i++) s += v[vk + i] * y[i];
	s *= tau[k];
	if (s !== 0) for (let i = k; i < m; i++) y[i] -= s * v[vk + i];
}

function colNorm(x: Float64Array, c: number, from: number, m: number): number {
	// Scaled sum of squares: capacitances spread over many decades, and their square roots'
	// squares must neither underflow nor lose the small ones.
	let scale = 0;
	let ssq = 1;
	for (let i = from; i < m; i++) {
		const a = Math.abs(x[c + i]);
		if (a === 0) continue;
		if (scale < a) {
			ssq = 1 + ssq * (scale / a) ** 2;
			scale = a;
		} else ssq += (a / scale) ** 2;
	}
	return scale * Math.sqrt(ssq);
}

function swapColumns(x: Float64Array, a: number, b: number, m: number): void {
	for (let i = 0; i < m; i++) {
		const t = x[a + i];
		x[a + i] = x[b + i];
		x[b + i] = t;
	}
}
