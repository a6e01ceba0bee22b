/**
 * Dense symmetric positive definite kernels on row-major Float64Arrays: the Cholesky factor and
 * triangular solves with many right-hand sides, each row operation along contiguous memory
 * (the modal reduction of the wide-band route, modal-route.ts, uses them once per analysis).
 */

/** Whether a is symmetric to 1e-14 of its largest entry. */
export function isSymmetric(a: Float64Array, n: number): boolean {
	let top = 0;
	for (let i = 0; i < a.length; i++) top = Math.max(top, Math.abs(a[i]));
	for (let i = 0; i < n; i++)
		for (let j = i + 1; j < n; j++)
			if (!(Math.abs(a[i * n + j] - a[j * n + i]) <= 1e-14 * top)) return false;
	return true;
}

/** Lower Cholesky factor (upper part zero), or null unless every pivot keeps more than
 *  `floor` of its diagonal entry (clearly definite). */
export function cholesky(a: Float64Array, n: number, floor: number): Float64Array | null {
	const l = new Float64Array(n * n);
	for (let j = 0; j < n; j++) {
		const rj = j * n;
		let d = a[rj + j];
		for (let k = 0; k < j; k++) d -= l[rj + k] * l[rj + k];
		if (!(d > floor * a[rj + j]) || !Number.isFinite(d)) return null;
		const ljj = Math.sqrt(d);
		l[rj + j] = ljj;
		for (let i = j + 1; i < n; i++) {
			const ri = i * n;
			let s = a[ri + j];
			for (let k = 0; k < j; k++) s -= l[ri + k] * l[rj + k];
			l[ri + j] = s / ljj;
		}
	}
	return l;
}

/** Row i of out −= f·(row k of out), then, once every f is applied, row i /= d. */
function eliminateRow(out: Float64Array, n: number, i: number, k: number, f: number): void {
	const ri = i * n;
	const rk = k * n;
	for (let j = 0; j < n; j++) out[ri + j] -= f * out[rk + j];
}

function divideRow(out: Float64Array, n: number, i: number, d: number): void {
	const ri = i * n;
	for (let j = 0; j < n; j++) out[ri + j] /= d;
}

/** L⁻¹·B (forward substitution on whole rows). */
export function lowerSolveRows(l: Float64Array, b: Float64Array, n: number): Float64Array {
	const out = b.slice();
	for (let i = 0; i < n; i++) {
		for (let k = 0; k < i; k++) if (l[i * n + k] !== 0) eliminateRow(out, n, i, k, l[i * n + k]);
		divideRow(out, n, i, l[i * n + i]);
	}
	return out;
}

/** L⁻ᵀ·B (back substitution with Lᵀ on whole rows). */
export function lowerTransposedSolveRows(
	l: Float64Array,
	b: Float64Array,
	n: number
): Float64Array {
	const out = b.slice();
	for (let i = n - 1; i >= 0; i--) {
		for (let k = i + 1; k < n; k++)
			if (l[k * n + i] !== 0) eliminateRow(out, n, i, k, l[k * n + i]);
		divideRow(out, n, i, l[i * n + i]);
	}
	return out;
}

export function transpose(a: Float64Array, n: number): Float64Array {
	const t = new Float64Array(n * n);
	for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) t[j * n + i] = a[i * n + j];
	return t;
}
