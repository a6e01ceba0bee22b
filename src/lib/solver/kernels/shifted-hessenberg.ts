/**
 * Solves (I + σ·H)·w = z for a real upper Hessenberg H and a complex σ, in O(n²): Gaussian
 * elimination with partial pivoting between neighbouring rows (the only rows with an entry
 * below the diagonal), then back substitution. This is the per-frequency step of Laub's
 * frequency-response method ("Efficient multivariable frequency response computations", IEEE
 * Trans. Autom. Control 26(2), 1981): H is reduced once, every σ then costs O(n²) instead of
 * the O(n³) of a fresh factorization. The factors are kept, so a second right-hand side (a
 * derivative) costs one more O(n²) substitution.
 *
 * Storage: H row-major n×n (entries below the subdiagonal ignored); U row-major in ur/ui.
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
}

export function shiftedFactorWorkspace(n: number): ShiftedFactor {
	return {
		n,
		ur: new Float64Array(n * n),
		ui: new Float64Array(n * n),
		lr: new Float64Array(Math.max(1, n)),
		li: new Float64Array(Math.max(1, n)),
		swap: new Uint8Array(Math.max(1, n))
	};
}

/**
 * Factors I + (sr + j·si)·H into f; false when a pivot is not finite or below `tiny` times
 * the largest entry of its row of U (the matrix is singular to working precision there).
 */
export function shiftedFactor(
	f: ShiftedFactor,
	h: Float64Array,
	sr: number,
	si: number,
	tiny = 0
): boolean {
	const { n, ur, ui, lr, li, swap } = f;
	for (let i = 0; i < n; i++) {
		const row = i * n;
		// Entries left of the subdiagonal stay zero: no step of the elimination writes there.
		const from = i === 0 ? 0 : i - 1;
		for (let j = from; j < n; j++) {
			const v = h[row + j];
			ur[row + j] = sr * v;
			ui[row + j] = si * v;
		}
		ur[row + i] += 1;
	}
	for (let k = 0; k < n - 1; k++) {
		const a = k * n;
		const b = a + n;
		const pivotMag = Math.abs(ur[a + k]) + Math.abs(ui[a + k]);
		const belowMag = Math.abs(ur[b + k]) + Math.abs(ui[b + k]);
		swap[k] = belowMag > pivotMag ? 1 : 0;
		if (swap[k]) {
			for (let j = k; j < n; j++) {
				let t = ur[a + j];
				ur[a + j] = ur[b + j];
				ur[b + j] = t;
				t = ui[a + j];
				ui[a + j] = ui[b + j];
				ui[b + j] = t;
			}
		}
		const pr = ur[a + k];
		const pi = ui[a + k];
		const d = pr * pr + pi * pi;
		if (!(d > 0) || !Number.isFinite(d)) return false;
		const xr = ur[b + k];
		const xi = ui[b + k];
		const mr = (xr * pr + xi * pi) / d;
		const mi = (xi * pr - xr * pi) / d;
		lr[k] = mr;
		li[k] = mi;
		ur[b + k] = 0;
		ui[b + k] = 0;
		if (mr === 0 && mi === 0) continue;
		for (let j = k + 1; j < n; j++) {
			const vr = ur[a + j];
			const vi = ui[a + j];
			ur[b + j] -= mr * vr - mi * vi;
			ui[b + j] -= mr * vi + mi * vr;
		}
	}
	for (let i = 0; i < n; i++) {
		const row = i * n;
		let big = 0;
		for (let j = i; j < n; j++) big = Math.max(big, Math.abs(ur[row + j]) + Math.abs(ui[row + j]));
		const p = Math.abs(ur[row + i]) + Math.abs(ui[row + i]);
		if (!(p > tiny * big) || !Number.isFinite(big) || p === 0) return false;
	}
	return true;
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
	for (let i = n - 1; i >= 0; i--) {
		const row = i * n;
		let sr = zr[i];
		let si = zi[i];
		for (let j = i + 1; j < n; j++) {
			const ar = ur[row + j];
			const ai = ui[row + j];
			sr -= ar * zr[j] - ai * zi[j];
			si -= ar * zi[j] + ai * zr[j];
		}
		const pr = ur[row + i];
		const pi = ui[row + i];
		const d = pr * pr + pi * pi;
		zr[i] = (sr * pr + si * pi) / d;
		zi[i] = (si * pr - sr * pi) / d;
	}
}
