import { bandOrder } from './band-order';

/**
 * Dense LU with partial pivoting on flat Float64Arrays (row-major). ml-matrix's Matrix keeps
 * rows as arrays behind get/set calls, which costs an order of magnitude on the n = 1000
 * benchmark; the factor is reused for many right-hand sides (one per reactive port).
 */
export interface RealLU {
	n: number;
	lu: Float64Array;
	piv: Int32Array;
	/** Row equilibration: row i was multiplied by rs[i] so its largest entry is 1. */
	rs: Float64Array;
	/** Smallest |pivot| of the equilibrated matrix: a cheap singularity indicator. */
	pivotRatio: number;
	/** Per row: first column of L's non-zeros (row i of L spans lo[i] … i − 1). */
	lo: Int32Array;
	/** Per row: one past the last column of U's non-zeros (row i of U spans i … hi[i] − 1). */
	hi: Int32Array;
	/** Symmetric renumbering the factors are in (q[new] = old), or null for the given order. */
	q: Int32Array | null;
	work: Float64Array;
}

/**
 * `band`: renumber unknowns first (band-order.ts) so a network matrix factors as a narrow band;
 * solves take and return vectors in the original numbering either way.
 */
export function luFactor(a: Float64Array, n: number, band = false): RealLU {
	const q = band ? bandOrder(a, n) : null;
	const piv = new Int32Array(n);
	// Node rows are in siemens and branch rows are dimensionless; equilibrating the rows makes
	// one pivot threshold mean the same thing for a 1 TΩ leakage path and an op-amp branch.
	// Renumbering, scaling and each row's last non-zero are done in one pass per row.
	const rs = new Float64Array(n);
	const lu = new Float64Array(n * n);
	// Network matrices are banded or nearly so: each row's non-zero extent is tracked through the
	// elimination (a row update extends it to the pivot row's), so work and solves skip the zeros.
	const hi = new Int32Array(n);
	for (let i = 0; i < n; i++) {
		const src = (q ? q[i] : i) * n;
		let mx = 0;
		for (let j = 0; j < n; j++) {
			const v = Math.abs(a[src + j]);
			if (v > mx) mx = v;
		}
		const scale = mx > 0 ? 1 / mx : 1;
		rs[i] = scale;
		const row = i * n;
		let last = i + 1;
		for (let j = 0; j < n; j++) {
			const v = a[src + (q ? q[j] : j)];
			if (v !== 0) {
				lu[row + j] = v * scale;
				if (j >= last) last = j + 1;
			}
		}
		hi[i] = last;
	}
	let minPivot = Infinity;
	for (let k = 0; k < n; k++) {
		let p = k;
		let best = Math.abs(lu[k * n + k]);
		for (let i = k + 1; i < n; i++) {
			const v = Math.abs(lu[i * n + k]);
			if (v > best) {
				best = v;
				p = i;
			}
		}
		piv[k] = p;
		if (p !== k) {
			for (let j = 0; j < n; j++) {
				const t = lu[k * n + j];
				lu[k * n + j] = lu[p * n + j];
				lu[p * n + j] = t;
			}
			const h = hi[k];
			hi[k] = hi[p];
			hi[p] = h;
		}
		minPivot = Math.min(minPivot, best);
		const d = lu[k * n + k];
		if (d === 0) continue;
		const rowK = k * n;
		const end = hi[k];
		for (let i = k + 1; i < n; i++) {
			const rowI = i * n;
			const f = lu[rowI + k] / d;
			if (f === 0) continue;
			lu[rowI + k] = f;
			for (let j = k + 1; j < end; j++) lu[rowI + j] -= f * lu[rowK + j];
			if (hi[i] < end) hi[i] = end;
		}
	}
	const lo = new Int32Array(n);
	for (let i = 0; i < n; i++) {
		let j = 0;
		while (j < i && lu[i * n + j] === 0) j++;
		lo[i] = j;
	}
	const pivotRatio = n === 0 ? 1 : minPivot;
	return { n, lu, piv, rs, pivotRatio, lo, hi, q, work: new Float64Array(q ? n : 0) };
}

/** Solves in place: b becomes x. */
export function luSolve(f: RealLU, b: Float64Array): Float64Array {
	if (!f.q) return solveInOrder(f, b);
	const { q, work, n } = f;
	for (let i = 0; i < n; i++) work[i] = b[q[i]];
	solveInOrder(f, work);
	for (let i = 0; i < n; i++) b[q[i]] = work[i];
	return b;
}

function solveInOrder(f: RealLU, b: Float64Array): Float64Array {
	const { n, lu, piv, rs } = f;
	for (let i = 0; i < n; i++) b[i] *= rs[i];
	for (let k = 0; k < n; k++) {
		const p = piv[k];
		if (p !== k) {
			const t = b[k];
			b[k] = b[p];
			b[p] = t;
		}
	}
	const { lo, hi } = f;
	for (let i = 1; i < n; i++) {
		let s = b[i];
		const row = i * n;
		for (let j = lo[i]; j < i; j++) s -= lu[row + j] * b[j];
		b[i] = s;
	}
	for (let i = n - 1; i >= 0; i--) {
		let s = b[i];
		const row = i * n;
		for (let j = i + 1, e = hi[i]; j < e; j++) s -= lu[row + j] * b[j];
		b[i] = s / lu[row + i];
	}
	return b;
}

/** Solves Aᵀ x = b in place with the same factors (used for output functionals). */
export function luSolveTransposed(f: RealLU, b: Float64Array): Float64Array {
	if (!f.q) return solveTransposedInOrder(f, b);
	const { q, work, n } = f;
	for (let i = 0; i < n; i++) work[i] = b[q[i]];
	solveTransposedInOrder(f, work);
	for (let i = 0; i < n; i++) b[q[i]] = work[i];
	return b;
}

function solveTransposedInOrder(f: RealLU, b: Float64Array): Float64Array {
	const { n, lu, piv, rs } = f;
	for (let i = 0; i < n; i++) {
		let s = b[i];
		for (let j = 0; j < i; j++) s -= lu[j * n + i] * b[j];
		b[i] = s / lu[i * n + i];
	}
	for (let i = n - 1; i >= 0; i--) {
		let s = b[i];
		for (let j = i + 1; j < n; j++) s -= lu[j * n + i] * b[j];
		b[i] = s;
	}
	for (let k = n - 1; k >= 0; k--) {
		const p = piv[k];
		if (p !== k) {
			const t = b[k];
			b[k] = b[p];
			b[p] = t;
		}
	}
	for (let i = 0; i < n; i++) b[i] *= rs[i];
	return b;
}
