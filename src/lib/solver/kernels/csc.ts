/**
 * Compressed sparse column storage (the layout of CSparse and of most sparse direct solvers):
 * column j's row indices are `rowIdx[colPtr[j] … colPtr[j+1] − 1]`, sorted ascending, with their
 * values at the same positions. Built from unsorted triplets with duplicates summed, because
 * element stamps add several contributions to one entry.
 */
export interface Csc {
	n: number;
	colPtr: Int32Array;
	rowIdx: Int32Array;
	values: Float64Array;
}

/** Triplets (row, column, value) collected in growable typed arrays. */
export class Triplets {
	n: number;
	count = 0;
	rows: Int32Array;
	cols: Int32Array;
	vals: Float64Array;
	constructor(n: number, capacity = 16) {
		this.n = n;
		this.rows = new Int32Array(capacity);
		this.cols = new Int32Array(capacity);
		this.vals = new Float64Array(capacity);
	}
	add(r: number, c: number, v: number): void {
		if (this.count === this.rows.length) {
			const cap = this.rows.length * 2;
			const grow = <T extends Int32Array | Float64Array>(a: T, b: T) => (b.set(a), b);
			this.rows = grow(this.rows, new Int32Array(cap));
			this.cols = grow(this.cols, new Int32Array(cap));
			this.vals = grow(this.vals, new Float64Array(cap));
		}
		this.rows[this.count] = r;
		this.cols[this.count] = c;
		this.vals[this.count++] = v;
	}
}

/**
 * Column-compress triplets, summing duplicates and sorting rows. `keepZeros` keeps entries whose
 * sum is exactly zero, so a pattern can carry structural places (a symbolic union) on purpose.
 */
export function cscFromTriplets(t: Triplets, keepZeros = false): Csc {
	const n = t.n;
	// Counting sort by row, then by column (stable): rows end up ascending within each column.
	const byRow = countingOrder(t.rows, t.count, n, null);
	const order = countingOrder(t.cols, t.count, n, byRow);
	const colPtr = new Int32Array(n + 1);
	const rowIdx = new Int32Array(t.count);
	const values = new Float64Array(t.count);
	let nz = 0;
	let k = 0;
	for (let j = 0; j < n; j++) {
		colPtr[j] = nz;
		while (k < t.count && t.cols[order[k]] === j) {
			const e = order[k++];
			const r = t.rows[e];
			if (nz > colPtr[j] && rowIdx[nz - 1] === r) values[nz - 1] += t.vals[e];
			else {
				rowIdx[nz] = r;
				values[nz++] = t.vals[e];
			}
		}
		if (!keepZeros) {
			// Drop exact cancellations (a stamp and its negative) so patterns stay structural.
			let w = colPtr[j];
			for (let p = colPtr[j]; p < nz; p++) {
				if (values[p] !== 0) {
					rowIdx[w] = rowIdx[p];
					values[w++] = values[p];
				}
			}
			nz = w;
		}
	}
	colPtr[n] = nz;
	return { n, colPtr, rowIdx: rowIdx.slice(0, nz), values: values.slice(0, nz) };
}

function countingOrder(
	keys: Int32Array,
	count: number,
	n: number,
	within: Int32Array | null
): Int32Array {
	const start = new Int32Array(n + 1);
	for (let i = 0; i < count; i++) start[keys[i] + 1]++;
	for (let i = 0; i < n; i++) start[i + 1] += start[i];
	const out = new Int32Array(count);
	for (let i = 0; i < count; i++) {
		const e = within ? within[i] : i;
		out[start[keys[e]]++] = e;
	}
	return out;
}

export function transpose(a: Csc): Csc {
	const { n, colPtr, rowIdx, values } = a;
	const nz = colPtr[n];
	const ptr = new Int32Array(n + 1);
	for (let p = 0; p < nz; p++) ptr[rowIdx[p] + 1]++;
	for (let i = 0; i < n; i++) ptr[i + 1] += ptr[i];
	const next = ptr.slice(0, n);
	const ri = new Int32Array(nz);
	const v = new Float64Array(nz);
	for (let j = 0; j < n; j++)
		for (let p = colPtr[j]; p < colPtr[j + 1]; p++) {
			const q = next[rowIdx[p]]++;
			ri[q] = j;
			v[q] = values[p];
		}
	return { n, colPtr: ptr, rowIdx: ri, values: v };
}

/** y = A·x (y is overwritten). */
export function multiply(a: Csc, x: Float64Array, y: Float64Array): Float64Array {
	return multiplyValues(a, a.values, x, y);
}

/** y = A·x for other values on A's pattern (G and C share one pattern; see sparse-mna.ts). */
export function multiplyValues(
	a: Csc,
	values: Float64Array,
	x: Float64Array,
	y: Float64Array
): Float64Array {
	y.fill(0);
	const { n, colPtr, rowIdx } = a;
	for (let j = 0; j < n; j++) {
		const xj = x[j];
		if (xj === 0) continue;
		for (let p = colPtr[j]; p < colPtr[j + 1]; p++) y[rowIdx[p]] += values[p] * xj;
	}
	return y;
}

/** Largest column sum of |values| on A's pattern (the 1-norm), for backward errors. */
export function norm1(a: Csc, values: Float64Array = a.values): number {
	let best = 0;
	for (let j = 0; j < a.n; j++) {
		let s = 0;
		for (let p = a.colPtr[j]; p < a.colPtr[j + 1]; p++) s += Math.abs(values[p]);
		if (s > best) best = s;
	}
	return best;
}

/** Entry (i, j), by binary search in column j (0 when absent). */
export function entry(a: Csc, i: number, j: number): number {
	let lo = a.colPtr[j];
	let hi = a.colPtr[j + 1] - 1;
	while (lo <= hi) {
		const mid = (lo + hi) >> 1;
		const r = a.rowIdx[mid];
		if (r === i) return a.values[mid];
		if (r < i) lo = mid + 1;
		else hi = mid - 1;
	}
	return 0;
}

/**
 * Adjacency of the symmetrized pattern A + Aᵀ without the diagonal, as CSC-like arrays
 * (`ptr`, `adj`): what orderings and elimination trees work on.
 */
export function symmetricPattern(a: Csc): { ptr: Int32Array; adj: Int32Array } {
	const n = a.n;
	const deg = new Int32Array(n + 1);
	for (let j = 0; j < n; j++)
		for (let p = a.colPtr[j]; p < a.colPtr[j + 1]; p++) {
			const i = a.rowIdx[p];
			if (i === j) continue;
			deg[i + 1]++;
			deg[j + 1]++;
		}
	for (let i = 0; i < n; i++) deg[i + 1] += deg[i];
	const next = deg.slice(0, n);
	const raw = new Int32Array(deg[n]);
	for (let j = 0; j < n; j++)
		for (let p = a.colPtr[j]; p < a.colPtr[j + 1]; p++) {
			const i = a.rowIdx[p];
			if (i === j) continue;
			raw[next[i]++] = j;
			raw[next[j]++] = i;
		}
	// Remove duplicates (an entry present in both A and Aᵀ) with a marker per row.
	const mark = new Int32Array(n).fill(-1);
	const ptr = new Int32Array(n + 1);
	let w = 0;
	for (let i = 0; i < n; i++) {
		ptr[i] = w;
		for (let p = deg[i]; p < deg[i + 1]; p++) {
			const j = raw[p];
			if (mark[j] === i) continue;
			mark[j] = i;
			raw[w++] = j;
		}
	}
	ptr[n] = w;
	return { ptr, adj: raw.slice(0, w) };
}

/** Inverse of a permutation given as q[new] = old. */
export function inversePermutation(q: Int32Array): Int32Array {
	const inv = new Int32Array(q.length);
	for (let i = 0; i < q.length; i++) inv[q[i]] = i;
	return inv;
}

/** P·A·Pᵀ for the permutation q[new] = old (rows and columns renumbered alike). */
export function permuteSymmetric(a: Csc, q: Int32Array): Csc {
	const n = a.n;
	const inv = inversePermutation(q);
	const t = new Triplets(n, a.colPtr[n]);
	for (let j = 0; j < n; j++)
		for (let p = a.colPtr[j]; p < a.colPtr[j + 1]; p++)
			t.add(inv[a.rowIdx[p]], inv[j], a.values[p]);
	return cscFromTriplets(t, true);
}
