/**
 * Eigenvalues and orthonormal eigenvectors of a real symmetric matrix: Householder reduction to
 * tridiagonal form, then the implicit QL iteration with Wilkinson-type shifts (the classical
 * tred2/tql2 pair of the Handbook for Automatic Computation, Wilkinson and Reinsch, 1971).
 *
 * It serves reciprocal RC networks, whose pole matrix D·H is similar to the symmetric
 * D^½·H·D^½: about half the work of the general Hessenberg QR plus inverse iteration, real
 * arithmetic throughout, and eigenvectors that are orthogonal by construction.
 *
 * Returns null when the iteration does not converge within its bound or meets a non-finite
 * value, so the caller can fall back to the general path.
 */
export interface SymmetricEigen {
	n: number;
	/** Eigenvalues, in the order found (not sorted). */
	values: Float64Array;
	/** Row k (k·n … k·n + n − 1) is the unit eigenvector of values[k]. */
	vectors: Float64Array;
}

const MAX_SWEEPS = 60;

export function symmetricEigen(a: Float64Array, n: number): SymmetricEigen | null {
	const V = a.slice();
	const d = new Float64Array(n);
	const e = new Float64Array(n);
	if (n === 0) return { n, values: d, vectors: V };
	tridiagonalize(V, d, e, n);
	// V comes back transposed (row k is column k of the transformation), so the QL rotations,
	// which build the eigenvectors as rows, touch two contiguous rows.
	if (!ql(V, d, e, n)) return null;
	return { n, values: d, vectors: V };
}

/**
 * tred2: on return V holds the orthogonal transformation, transposed, d the diagonal, e the
 * sub-diagonal. The classical loops walk down columns; with the matrix symmetric, indexing it
 * transposed makes those inner loops run along contiguous rows instead (2–3× at n = 300).
 */
function tridiagonalize(V: Float64Array, d: Float64Array, e: Float64Array, n: number): void {
	for (let j = 0; j < n; j++) d[j] = V[j * n + n - 1];
	for (let i = n - 1; i > 0; i--) {
		let scale = 0;
		let h = 0;
		for (let k = 0; k < i; k++) scale += Math.abs(d[k]);
		if (scale === 0) {
			e[i] = d[i - 1];
			for (let j = 0; j < i; j++) {
				d[j] = V[j * n + i - 1];
				V[j * n + i] = 0;
				V[i * n + j] = 0;
			}
		} else {
			for (let k = 0; k < i; k++) {
				d[k] /= scale;
				h += d[k] * d[k];
			}
			let f = d[i - 1];
			let g = Math.sqrt(h);
			if (f > 0) g = -g;
			e[i] = scale * g;
			h -= f * g;
			d[i - 1] = f - g;
			for (let j = 0; j < i; j++) e[j] = 0;
			for (let j = 0; j < i; j++) {
				f = d[j];
				V[i * n + j] = f;
				g = e[j] + V[j * n + j] * f;
				for (let k = j + 1; k <= i - 1; k++) {
					const vkj = V[j * n + k];
					g += vkj * d[k];
					e[k] += vkj * f;
				}
				e[j] = g;
			}
			f = 0;
			for (let j = 0; j < i; j++) {
				e[j] /= h;
				f += e[j] * d[j];
			}
			const hh = f / (h + h);
			for (let j = 0; j < i; j++) e[j] -= hh * d[j];
			for (let j = 0; j < i; j++) {
				f = d[j];
				g = e[j];
				for (let k = j; k <= i - 1; k++) V[j * n + k] -= f * e[k] + g * d[k];
				d[j] = V[j * n + i - 1];
				V[j * n + i] = 0;
			}
		}
		d[i] = h;
	}
	// Accumulate the transformations.
	for (let i = 0; i < n - 1; i++) {
		V[i * n + n - 1] = V[i * n + i];
		V[i * n + i] = 1;
		const h = d[i + 1];
		if (h !== 0) {
			for (let k = 0; k <= i; k++) d[k] = V[(i + 1) * n + k] / h;
			for (let j = 0; j <= i; j++) {
				let g = 0;
				for (let k = 0; k <= i; k++) g += V[(i + 1) * n + k] * V[j * n + k];
				for (let k = 0; k <= i; k++) V[j * n + k] -= g * d[k];
			}
		}
		for (let k = 0; k <= i; k++) V[(i + 1) * n + k] = 0;
	}
	for (let j = 0; j < n; j++) {
		d[j] = V[j * n + n - 1];
		V[j * n + n - 1] = 0;
	}
	V[(n - 1) * n + n - 1] = 1;
	e[0] = 0;
}

/** tql2 on the tridiagonal (d, e), rotating the rows of W; false when it fails to converge. */
function ql(W: Float64Array, d: Float64Array, e: Float64Array, n: number): boolean {
	for (let i = 1; i < n; i++) e[i - 1] = e[i];
	e[n - 1] = 0;
	let f = 0;
	let tst1 = 0;
	const eps = Number.EPSILON;
	for (let l = 0; l < n; l++) {
		tst1 = Math.max(tst1, Math.abs(d[l]) + Math.abs(e[l]));
		let m = l;
		while (m < n - 1 && Math.abs(e[m]) > eps * tst1) m++;
		if (m > l) {
			let sweeps = 0;
			do {
				if (++sweeps > MAX_SWEEPS || !Number.isFinite(tst1)) return false;
				let g = d[l];
				let p = (d[l + 1] - g) / (2 * e[l]);
				let r = Math.hypot(p, 1);
				if (p < 0) r = -r;
				d[l] = e[l] / (p + r);
				d[l + 1] = e[l] * (p + r);
				const dl1 = d[l + 1];
				let h = g - d[l];
				for (let i = l + 2; i < n; i++) d[i] -= h;
				f += h;
				p = d[m];
				let c = 1;
				let c2 = c;
				let c3 = c;
				const el1 = e[l + 1];
				let s = 0;
				let s2 = 0;
				for (let i = m - 1; i >= l; i--) {
					c3 = c2;
					c2 = c;
					s2 = s;
					g = c * e[i];
					h = c * p;
					r = Math.hypot(p, e[i]);
					e[i + 1] = s * r;
					s = e[i] / r;
					c = p / r;
					p = c * d[i] - s * g;
					d[i + 1] = h + s * (c * g + s * d[i]);
					const ri = i * n;
					const rj = ri + n;
					for (let k = 0; k < n; k++) {
						const wk = W[rj + k];
						const vk = W[ri + k];
						W[rj + k] = s * vk + c * wk;
						W[ri + k] = c * vk - s * wk;
					}
				}
				p = (-s * s2 * c3 * el1 * e[l]) / dl1;
				e[l] = s * p;
				d[l] = c * p;
				if (!Number.isFinite(d[l]) || !Number.isFinite(e[l])) return false;
			} while (Math.abs(e[l]) > eps * tst1);
		}
		d[l] = d[l] + f;
		e[l] = 0;
	}
	return true;
}
