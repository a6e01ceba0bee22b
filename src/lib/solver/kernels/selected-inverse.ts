import type { Ldl } from './ldl';

/**
 * Selected inversion: the entries of Z = A⁻¹ on the pattern of the factor L (and its
 * diagonal), from A = L·D·Lᵀ without forming any other entry of the inverse — Takahashi, Fagan
 * and Chin, "Formation of a sparse bus impedance matrix and its application to short circuit
 * study", 8th PICA Conference, 1973. From Z = D⁻¹L⁻¹ + (I − Lᵀ)Z, column j from the last:
 *
 *     Z_ij = −Σ_{k ∈ S_j} Z_ik L_kj   (i ∈ S_j),     Z_jj = 1/d_j − Σ_{k ∈ S_j} L_kj Z_kj,
 *
 * with S_j the rows of column j of L. Every Z_ik needed lies on the pattern already computed
 * (the rows of a column of L form a clique in later columns), so the cost is about that of the
 * factorization. For an accurate M-matrix factor every term is non-negative (L ≤ 0, Z ≥ 0), so
 * the entries keep the factor's accuracy.
 */
export interface SelectedInverse {
	/** Diagonal of A⁻¹ in the permuted numbering. */
	zd: Float64Array;
	/** Off-diagonal entries on L's pattern (aligned with symbolic.rowIdx). */
	zx: Float64Array;
}

export function selectedInverse(f: Ldl): SelectedInverse {
	const { n, colPtr, rowIdx } = f.symbolic;
	const { lx, d } = f;
	const zd = new Float64Array(n);
	const zx = new Float64Array(rowIdx.length);
	const pos = new Int32Array(n).fill(-1);
	let acc = new Float64Array(16);
	for (let j = n - 1; j >= 0; j--) {
		const start = colPtr[j];
		const len = colPtr[j + 1] - start;
		if (acc.length < len) acc = new Float64Array(2 * len);
		for (let b = 0; b < len; b++) {
			pos[rowIdx[start + b]] = b;
			acc[b] = 0;
		}
		for (let b = 0; b < len; b++) {
			const k = rowIdx[start + b];
			const lk = lx[start + b];
			acc[b] -= zd[k] * lk;
			// Z_ik for rows i > k of the clique live in column k; use each entry both ways.
			for (let q = colPtr[k]; q < colPtr[k + 1]; q++) {
				const a = pos[rowIdx[q]];
				if (a < 0) continue;
				acc[a] -= zx[q] * lk;
				acc[b] -= zx[q] * lx[start + a];
			}
		}
		let zjj = 1 / d[j];
		for (let b = 0; b < len; b++) {
			zx[start + b] = acc[b];
			zjj -= lx[start + b] * acc[b];
			pos[rowIdx[start + b]] = -1;
		}
		zd[j] = zjj;
	}
	return { zd, zx };
}

/** Diagonal of A⁻¹ in the original numbering. */
export function inverseDiagonal(f: Ldl, z: SelectedInverse): Float64Array {
	const out = new Float64Array(f.symbolic.n);
	const { order } = f.symbolic;
	for (let i = 0; i < out.length; i++) out[order[i]] = z.zd[i];
	return out;
}

/**
 * Entry (a, b) of A⁻¹ (original numbering) when it lies on the factor's pattern, else NaN: the
 * caller asks for the pattern to include every pair it will need (see sparse-ports.ts).
 */
export function inverseEntry(f: Ldl, z: SelectedInverse, a: number, b: number): number {
	const { inverse, colPtr, rowIdx } = f.symbolic;
	let i = inverse[a];
	let j = inverse[b];
	if (i === j) return z.zd[i];
	if (i < j) [i, j] = [j, i];
	let lo = colPtr[j];
	let hi = colPtr[j + 1] - 1;
	while (lo <= hi) {
		const mid = (lo + hi) >> 1;
		if (rowIdx[mid] === i) return z.zx[mid];
		if (rowIdx[mid] < i) lo = mid + 1;
		else hi = mid - 1;
	}
	return NaN;
}
