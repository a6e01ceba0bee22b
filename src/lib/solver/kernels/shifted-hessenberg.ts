/**
 * Solves (I + σ·H)·w = z for a real upper Hessenberg H and a complex σ, in O(n²): Gaussian
 * elimination with partial pivoting between neighbouring rows (the only rows with an entry
 * below the diagonal), then back substitution. This is the per-frequency step of Laub's
 * frequency-response method ("Efficient multivariable frequency response computations", IEEE
 * Trans. Autom. Control 26(2), 1981): H is reduced once, every σ then costs O(n²) instead of
 * the O(n³) of a fresh factorization. The factors are kept, so a second right-hand side (a
 * derivative) costs one more O(n²) substitution.
 *
 * Storage: H row-major n×n (entries below the subdiagonal ignored); U row-major in ur/ui, on
 * and above the diagonal only (the solve reads nothing else).
 */
export interface ShiftedFactor {
	n: number;
	ur: Float64Array;
	ui: Float64Array;
	/** Multiplier of step k (row k+1 −= l·row k after the optional swap). */
	lr: Float64Array;
	li: Float64Array;
	/** 1 where rows k and k+1 were swapped at step k. */
	swap: Uint8Array;
	/** Work: the row not yet final (the one step k eliminates from), real and imaginary. */
	cr: Float64Array;
	ci: Float64Array;
}

export function shiftedFactorWorkspace(n: number): ShiftedFactor {
	return {
		n,
		ur: new Float64Array(n * n),
		ui: new Float64Array(n * n),
		lr: new Float64Array(Math.max(1, n)),
		li: new Float64Array(Math.max(1, n)),
		swap: new Uint8Array(Math.max(1, n)),
		cr: new Float64Array(Math.max(1, n)),
		ci: new Float64Array(Math.max(1, n))
	};
}

/**
 * Factors I + (sr + j·si)·H into f; false when a pivot is not finite or below `tiny` times
 * the largest entry of its row of U (the matrix is singular to working precision there).
 *
 * One pass per step: row k + 1 of I + σH is untouched until step k, so it is formed there from
 * H as it is eliminated, and row k of U is written and measured (for the pivot test) as it
 * becomes final. The operations are the textbook ones in the same order (bit-identical
 * factors); fusing the three passes saves a third of the time at n = 152.
 */
export function shiftedFactor(
	f: ShiftedFactor,
	h: Float64Array,
	sr: number,
	si: number,
	tiny = 0
): boolean {
	const { n, ur, ui, lr, li, swap, cr, ci } = f;
	if (n === 0) return true;
	for (let j = 0; j < n; j++) {
		const v = h[j];
		cr[j] = sr * v;
		ci[j] = si * v;
	}
	cr[0] += 1;
	for (let k = 0; k < n - 1; k++) {
		const a = k * n;
		const b = a + n;
		// Column k: the carried row's entry against the fresh row's σ·H[k+1, k].
		const hk = h[b + k];
		const fkr = sr * hk;
		const fki = si * hk;
		const ckr = cr[k];
		const cki = ci[k];
		const swapped = Math.abs(fkr) + Math.abs(fki) > Math.abs(ckr) + Math.abs(cki);
		swap[k] = swapped ? 1 : 0;
		const pr = swapped ? fkr : ckr;
		const pi = swapped ? fki : cki;
		const xr = swapped ? ckr : fkr;
		const xi = swapped ? cki : fki;
		const d = pr * pr + pi * pi;
		if (!(d > 0) || !Number.isFinite(d)) return false;
		const mr = (xr * pr + xi * pi) / d;
		const mi = (xi * pr - xr * pi) / d;
		lr[k] = mr;
		li[k] = mi;
		ur[a + k] = pr;
		ui[a + k] = pi;
		const p = Math.abs(pr) + Math.abs(pi);
		let big = p;
		if (swapped) {
			// The fresh row is the pivot row; the carried one is eliminated by it.
			for (let j = k + 1; j < n; j++) {
				const v = h[b + j];
				const fr = sr * v + (j === k + 1 ? 1 : 0);
				const fi = si * v;
				ur[a + j] = fr;
				ui[a + j] = fi;
				const size = Math.abs(fr) + Math.abs(fi);
				if (size > big) big = size;
				cr[j] -= mr * fr - mi * fi;
				ci[j] -= mr * fi + mi * fr;
			}
		} else {
			for (let j = k + 1; j < n; j++) {
				const v = h[b + j];
				const fr = sr * v + (j === k + 1 ? 1 : 0);
				const fi = si * v;
				const qr = cr[j];
				const qi = ci[j];
				ur[a + j] = qr;
				ui[a + j] = qi;
				const size = Math.abs(qr) + Math.abs(qi);
				if (size > big) big = size;
				cr[j] = fr - (mr * qr - mi * qi);
				ci[j] = fi - (mr * qi + mi * qr);
			}
		}
		if (!(p > tiny * big) || !Number.isFinite(big)) return false;
	}
	const last = (n - 1) * n + n - 1;
	ur[last] = cr[n - 1];
	ui[last] = ci[n - 1];
	const p = Math.abs(cr[n - 1]) + Math.abs(ci[n - 1]);
	return p > 0 && Number.isFinite(p);
}

/** Solves in place with the factors of shiftedFactor: (zr, zi) becomes w. */
export function shiftedSolve(f: ShiftedFactor, zr: Float64Array, zi: Float64Array): void {
	const { n, ur, ui, lr, li, swap } = f;
	for (let k = 0; k < n - 1; k++) {
		if (swap[k]) {
			let t = zr[k];
			zr[k] = zr[k + 1];
			zr[k + 1] = t;
			t = zi[k];
			zi[k] = zi[k + 1];
			zi[k + 1] = t;
		}
		const xr = zr[k];
		const xi = zi[k];
		zr[k + 1] -= lr[k] * xr - li[k] * xi;
		zi[k + 1] -= lr[k] * xi + li[k] * xr;
	}
	// Back substitution two rows a pass (rows i and i − 1 share every load of w beyond i):
	// 1.4× faster at n = 152; row i − 1 then takes w_i's term last instead of first.
	let i = n - 1;
	for (; i >= 1; i -= 2) {
		const a = i * n;
		const b = a - n;
		let sr = zr[i];
		let si = zi[i];
		let tr = zr[i - 1];
		let ti = zi[i - 1];
		for (let j = i + 1; j < n; j++) {
			const xr = zr[j];
			const xi = zi[j];
			const ar = ur[a + j];
			const ai = ui[a + j];
			const br = ur[b + j];
			const bi = ui[b + j];
			sr -= ar * xr - ai * xi;
			si -= ar * xi + ai * xr;
			tr -= br * xr - bi * xi;
			ti -= br * xi + bi * xr;
		}
		let pr = ur[a + i];
		let pi = ui[a + i];
		let d = pr * pr + pi * pi;
		const wr = (sr * pr + si * pi) / d;
		const wi = (si * pr - sr * pi) / d;
		zr[i] = wr;
		zi[i] = wi;
		const cr = ur[b + i];
		const ci = ui[b + i];
		tr -= cr * wr - ci * wi;
		ti -= cr * wi + ci * wr;
		pr = ur[b + i - 1];
		pi = ui[b + i - 1];
		d = pr * pr + pi * pi;
		zr[i - 1] = (tr * pr + ti * pi) / d;
		zi[i - 1] = (ti * pr - tr * pi) / d;
	}
	if (i === 0) {
		let sr = zr[0];
		let si = zi[0];
		for (let j = 1; j < n; j++) {
			sr -= ur[j] * zr[j] - ui[j] * zi[j];
			si -= ur[j] * zi[j] + ui[j] * zr[j];
		}
		const d = ur[0] * ur[0] + ui[0] * ui[0];
		zr[0] = (sr * ur[0] + si * ui[0]) / d;
		zi[0] = (si * ur[0] - sr * ui[0]) / d;
	}
}
