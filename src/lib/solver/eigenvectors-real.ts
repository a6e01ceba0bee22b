import type { Hessenberg } from './hessenberg';
import type { EigenPair } from './eigenvectors';

const norms = new WeakMap<Hessenberg, number>();

/** Largest |entry| of the Hessenberg matrix, computed once per matrix. */
export function hessNorm(hs: Hessenberg): number {
	let norm = norms.get(hs);
	if (norm === undefined) {
		norm = 0;
		for (let i = 0; i < hs.n * hs.n; i++) norm = Math.max(norm, Math.abs(hs.h[i]));
		norms.set(hs, norm);
	}
	return norm;
}

export function normalize(r: Float64Array, i: Float64Array) {
	let m = 0;
	for (let k = 0; k < r.length; k++) m = Math.max(m, Math.hypot(r[k], i[k]));
	if (!(m > 0) || !Number.isFinite(m)) return;
	for (let k = 0; k < r.length; k++) {
		r[k] /= m;
		i[k] /= m;
	}
}

let rwork: { n: number; u: Float64Array } | null = null;

/**
 * The same inverse-iteration step in real arithmetic, for real eigenvalues (all of them in an RC
 * network): a quarter of the work of the complex path.
 */
export function realEigenvectors(hs: Hessenberg, lr: number): EigenPair {
	const n = hs.n;
	const H = hs.h;
	const norm = hessNorm(hs);
	const delta = Math.max(Math.abs(lr), norm) * 1e-13 + Number.MIN_VALUE;
	const sr = lr + delta;
	if (!rwork || rwork.n !== n) rwork = { n, u: new Float64Array(n * n) };
	const u = rwork.u;
	for (let i = 0; i < n; i++) {
		for (let j = Math.max(0, i - 1); j < n; j++) u[i * n + j] = H[i * n + j];
		u[i * n + i] -= sr;
	}
	const mult = new Float64Array(n);
	const swap = new Uint8Array(n);
	for (let k = 0; k < n - 1; k++) {
		if (Math.abs(u[(k + 1) * n + k]) > Math.abs(u[k * n + k])) {
			swap[k] = 1;
			for (let j = k; j < n; j++) {
				const t = u[k * n + j];
				u[k * n + j] = u[(k + 1) * n + j];
				u[(k + 1) * n + j] = t;
			}
		}
		if (u[k * n + k] === 0) u[k * n + k] = delta;
		const f = u[(k + 1) * n + k] / u[k * n + k];
		mult[k] = f;
		u[(k + 1) * n + k] = 0;
		if (f !== 0) for (let j = k + 1; j < n; j++) u[(k + 1) * n + j] -= f * u[k * n + j];
	}
	if (u[n * n - 1] === 0) u[n * n - 1] = delta;
	const x = new Float64Array(n).fill(1);
	const y = new Float64Array(n).fill(1);
	for (let k = 0; k < n - 1; k++) {
		if (swap[k]) {
			const t = x[k];
			x[k] = x[k + 1];
			x[k + 1] = t;
		}
		x[k + 1] -= mult[k] * x[k];
	}
	for (let i = n - 1; i >= 0; i--) {
		let s = x[i];
		for (let j = i + 1; j < n; j++) s -= u[i * n + j] * x[j];
		x[i] = s / u[i * n + i];
	}
	for (let i = 0; i < n; i++) {
		let s = y[i];
		for (let j = 0; j < i; j++) s -= u[j * n + i] * y[j];
		y[i] = s / u[i * n + i];
	}
	for (let k = n - 2; k >= 0; k--) {
		y[k] -= mult[k] * y[k + 1];
		if (swap[k]) {
			const t = y[k];
			y[k] = y[k + 1];
			y[k + 1] = t;
		}
	}
	const zero = new Float64Array(n);
	normalize(x, zero);
	normalize(y, zero);
	const { q, scale } = hs;
	const out = {
		xr: new Float64Array(n),
		xi: new Float64Array(n),
		yr: new Float64Array(n),
		yi: new Float64Array(n)
	};
	for (let i = 0; i < n; i++) {
		let a = 0;
		let c = 0;
		const row = i * n;
		for (let k = 0; k < n; k++) {
			a += q[row + k] * x[k];
			c += q[row + k] * y[k];
		}
		out.xr[i] = a * scale[i];
		out.yr[i] = c / scale[i];
	}
	return out;
}
