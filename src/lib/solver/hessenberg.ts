/**
 * Balancing and Householder reduction to upper Hessenberg form, keeping the orthogonal Q (for
 * eigenvectors) unless the caller only wants eigenvalues. Flat row-major Float64Arrays.
 */
export interface Hessenberg {
	n: number;
	/** Balanced, reduced matrix Hs = Qᵀ (B⁻¹ A B) Q, row-major. */
	h: Float64Array;
	/** Orthogonal Q, row-major. */
	q: Float64Array;
	/** Balancing scale B (diagonal). */
	scale: Float64Array;
}

/** Parlett–Reinsch balancing by powers of two: makes small eigenvalues of graded matrices exact to more digits. */
function balance(a: Float64Array, n: number): Float64Array {
	const scale = new Float64Array(n).fill(1);
	for (let sweep = 0, done = false; !done && sweep < 100; sweep++) {
		done = true;
		for (let i = 0; i < n; i++) {
			let c = 0;
			let r = 0;
			for (let j = 0; j < n; j++) {
				if (j === i) continue;
				c += Math.abs(a[j * n + i]);
				r += Math.abs(a[i * n + j]);
			}
			if (c === 0 || r === 0) continue;
			const s = c + r;
			let f = 1;
			let cc = c;
			const rr = r;
			while (cc < rr / 2) {
				cc *= 4;
				f *= 2;
			}
			while (cc >= rr * 2) {
				cc /= 4;
				f /= 2;
			}
			if ((c * f + r / f) / s < 0.95) {
				done = false;
				scale[i] *= f;
				for (let j = 0; j < n; j++) a[i * n + j] /= f;
				for (let j = 0; j < n; j++) a[j * n + i] *= f;
			}
		}
	}
	return scale;
}

export function hessenberg(a0: Float64Array, n: number, wantQ = true): Hessenberg {
	const h = a0.slice();
	const scale = balance(h, n);
	const ort = new Float64Array(n);
	const q = new Float64Array(n * n);
	for (let m = 1; m < n - 1; m++) {
		let sc = 0;
		for (let i = m; i < n; i++) sc += Math.abs(h[i * n + m - 1]);
		if (sc === 0) continue;
		let hh = 0;
		for (let i = n - 1; i >= m; i--) {
			ort[i] = h[i * n + m - 1] / sc;
			hh += ort[i] * ort[i];
		}
		let g = Math.sqrt(hh);
		if (ort[m] > 0) g = -g;
		hh -= ort[m] * g;
		ort[m] -= g;
		for (let j = m; j < n; j++) {
			let f = 0;
			for (let i = n - 1; i >= m; i--) f += ort[i] * h[i * n + j];
			f /= hh;
			for (let i = m; i < n; i++) h[i * n + j] -= f * ort[i];
		}
		for (let i = 0; i < n; i++) {
			let f = 0;
			const row = i * n;
			for (let j = n - 1; j >= m; j--) f += ort[j] * h[row + j];
			f /= hh;
			for (let j = m; j < n; j++) h[row + j] -= f * ort[j];
		}
		ort[m] *= sc;
		h[m * n + m - 1] = sc * g;
		// Keep the Householder vector (one consistent scale) for accumulating Q, and leave the
		// stored Hessenberg matrix clean below the subdiagonal.
		for (let i = m + 1; i < n; i++) {
			q[i * n + m - 1] = ort[i] * sc;
			h[i * n + m - 1] = 0;
		}
		q[m * n + m - 1] = ort[m];
	}
	// Accumulate Q from the stored vectors (backward, as EISPACK ortran does); the zeros need no
	// eigenvectors, so they skip this third of the reduction.
	const v = new Float64Array(n);
	const Q = new Float64Array(wantQ ? n * n : 0);
	if (!wantQ) return { n, h, q: Q, scale };
	for (let i = 0; i < n; i++) Q[i * n + i] = 1;
	for (let m = n - 2; m >= 1; m--) {
		const hsub = h[m * n + m - 1];
		if (hsub === 0) continue;
		for (let i = m; i < n; i++) v[i] = q[i * n + m - 1];
		if (v[m] === 0) continue;
		for (let j = m; j < n; j++) {
			let g = 0;
			for (let i = m; i < n; i++) g += v[i] * Q[i * n + j];
			g = g / v[m] / hsub;
			for (let i = m; i < n; i++) Q[i * n + j] += g * v[i];
		}
	}
	return { n, h, q: Q, scale };
}
