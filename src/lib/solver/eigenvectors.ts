import type { Hessenberg } from './hessenberg';
import { hessNorm, normalize, realEigenvectors } from './eigenvectors-real';

/**
 * Right and left eigenvectors for given eigenvalues by inverse iteration on the Hessenberg
 * form: one O(n²) complex Hessenberg factorization per eigenvalue, the same factors solve the
 * transposed (left) system. Vectors are returned in the coordinates of the original matrix
 * (Q and the balancing scale undone), complex as separate re/im arrays.
 */
export interface EigenPair {
	xr: Float64Array;
	xi: Float64Array;
	yr: Float64Array;
	yi: Float64Array;
}

/** Work arrays reused across eigenvalues: m² each, allocated once per matrix size. */
let work: { n: number; ur: Float64Array; ui: Float64Array } | null = null;

export function eigenvectors(hs: Hessenberg, lr: number, li: number): EigenPair {
	if (li === 0) return realEigenvectors(hs, lr);
	const n = hs.n;
	const H = hs.h;
	// Perturb the shift a hair off the computed eigenvalue so the factorization is not exactly
	// singular; one inverse-iteration step then suffices, because the growth factor towards the
	// wanted vector is about 1e13 against the next eigenvalue.
	const norm = hessNorm(hs);
	const delta = Math.max(Math.hypot(lr, li), norm) * 1e-13 + Number.MIN_VALUE;
	const sr = lr + delta;
	const si = li;
	// Factor (H − λI) = P L U with Hessenberg structure: at column k only rows k and k+1 compete.
	if (!work || work.n !== n) work = { n, ur: new Float64Array(n * n), ui: new Float64Array(n * n) };
	const { ur, ui } = work;
	// Only the Hessenberg band is ever read or written, so only it is (re)initialized.
	for (let i = 0; i < n; i++) {
		for (let j = Math.max(0, i - 1); j < n; j++) {
			ur[i * n + j] = H[i * n + j];
			ui[i * n + j] = 0;
		}
		ur[i * n + i] -= sr;
		ui[i * n + i] = -si;
	}
	const mr = new Float64Array(n);
	const mi = new Float64Array(n);
	const swap = new Uint8Array(n);
	for (let k = 0; k < n - 1; k++) {
		const a = Math.hypot(ur[k * n + k], ui[k * n + k]);
		const b = Math.hypot(ur[(k + 1) * n + k], ui[(k + 1) * n + k]);
		if (b > a) {
			swap[k] = 1;
			for (let j = k; j < n; j++) {
				let t = ur[k * n + j];
				ur[k * n + j] = ur[(k + 1) * n + j];
				ur[(k + 1) * n + j] = t;
				t = ui[k * n + j];
				ui[k * n + j] = ui[(k + 1) * n + j];
				ui[(k + 1) * n + j] = t;
			}
		}
		let dr = ur[k * n + k];
		const di = ui[k * n + k];
		if (dr === 0 && di === 0) {
			dr = delta;
			ur[k * n + k] = delta;
		}
		const d2 = dr * dr + di * di;
		const br = ur[(k + 1) * n + k];
		const bi = ui[(k + 1) * n + k];
		const fr = (br * dr + bi * di) / d2;
		const fi = (bi * dr - br * di) / d2;
		mr[k] = fr;
		mi[k] = fi;
		ur[(k + 1) * n + k] = 0;
		ui[(k + 1) * n + k] = 0;
		for (let j = k + 1; j < n; j++) {
			const xr = ur[k * n + j];
			const xi = ui[k * n + j];
			ur[(k + 1) * n + j] -= fr * xr - fi * xi;
			ui[(k + 1) * n + j] -= fr * xi + fi * xr;
		}
	}
	if (ur[n * n - 1] === 0 && ui[n * n - 1] === 0) ur[n * n - 1] = delta;

	const xr = new Float64Array(n).fill(1);
	const xi = new Float64Array(n);
	const yr = new Float64Array(n).fill(1);
	const yi = new Float64Array(n);
	for (let it = 0; it < 1; it++) {
		// Right: L U x = P b. Apply the eliminations to b, then back-substitute.
		for (let k = 0; k < n - 1; k++) {
			if (swap[k]) {
				let t = xr[k];
				xr[k] = xr[k + 1];
				xr[k + 1] = t;
				t = xi[k];
				xi[k] = xi[k + 1];
				xi[k + 1] = t;
			}
			xr[k + 1] -= mr[k] * xr[k] - mi[k] * xi[k];
			xi[k + 1] -= mr[k] * xi[k] + mi[k] * xr[k];
		}
		backSubstitute(ur, ui, n, xr, xi);
		normalize(xr, xi);
		// Left: (PLU)ᵀ y = b → Uᵀ w = b, then the eliminations transposed in reverse.
		forwardTransposed(ur, ui, n, yr, yi);
		for (let k = n - 2; k >= 0; k--) {
			yr[k] -= mr[k] * yr[k + 1] - mi[k] * yi[k + 1];
			yi[k] -= mr[k] * yi[k + 1] + mi[k] * yr[k + 1];
			if (swap[k]) {
				let t = yr[k];
				yr[k] = yr[k + 1];
				yr[k + 1] = t;
				t = yi[k];
				yi[k] = yi[k + 1];
				yi[k + 1] = t;
			}
		}
		normalize(yr, yi);
	}
	return backTransform(hs, xr, xi, yr, yi);
}

function backSubstitute(
	ur: Float64Array,
	ui: Float64Array,
	n: number,
	br: Float64Array,
	bi: Float64Array
) {
	for (let i = n - 1; i >= 0; i--) {
		let sr = br[i];
		let si = bi[i];
		for (let j = i + 1; j < n; j++) {
			sr -= ur[i * n + j] * br[j] - ui[i * n + j] * bi[j];
			si -= ur[i * n + j] * bi[j] + ui[i * n + j] * br[j];
		}
		const dr = ur[i * n + i];
		const di = ui[i * n + i];
		const d2 = dr * dr + di * di;
		br[i] = (sr * dr + si * di) / d2;
		bi[i] = (si * dr - sr * di) / d2;
	}
}

function forwardTransposed(
	ur: Float64Array,
	ui: Float64Array,
	n: number,
	br: Float64Array,
	bi: Float64Array
) {
	for (let i = 0; i < n; i++) {
		let sr = br[i];
		let si = bi[i];
		for (let j = 0; j < i; j++) {
			sr -= ur[j * n + i] * br[j] - ui[j * n + i] * bi[j];
			si -= ur[j * n + i] * bi[j] + ui[j * n + i] * br[j];
		}
		const dr = ur[i * n + i];
		const di = ui[i * n + i];
		const d2 = dr * dr + di * di;
		br[i] = (sr * dr + si * di) / d2;
		bi[i] = (si * dr - sr * di) / d2;
	}
}

/** x = B Q x_H and y = B⁻¹ Q y_H: the similarity that produced the Hessenberg form, undone. */
function backTransform(
	hs: Hessenberg,
	hxr: Float64Array,
	hxi: Float64Array,
	hyr: Float64Array,
	hyi: Float64Array
): EigenPair {
	const { n, q, scale } = hs;
	const out = {
		xr: new Float64Array(n),
		xi: new Float64Array(n),
		yr: new Float64Array(n),
		yi: new Float64Array(n)
	};
	for (let i = 0; i < n; i++) {
		let a = 0,
			b = 0,
			c = 0,
			d = 0;
		const row = i * n;
		for (let k = 0; k < n; k++) {
			const qk = q[row + k];
			a += qk * hxr[k];
			b += qk * hxi[k];
			c += qk * hyr[k];
			d += qk * hyi[k];
		}
		out.xr[i] = a * scale[i];
		out.xi[i] = b * scale[i];
		out.yr[i] = c / scale[i];
		out.yi[i] = d / scale[i];
	}
	return out;
}
