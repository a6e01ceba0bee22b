import { cluFactor, cluSolve } from './complex-lu';
import { solveMatrix } from './kernels/expm';
import type { PortModel } from './port-model';
import { poleMatrix } from './spectrum';

/**
 * A state-space model ẋ = A·x + B·u, y = C·x + D·u of the transfer, built from the shifted port
 * model without eigenvectors, for the step response by the matrix exponential (step-state.ts).
 *
 * With M = D·H at the shift s0, H(s) = h0 − σ·g·(I + σM)⁻¹·D·h (σ = s − s0). The finite poles
 * live on range(M); its complement null(M) holds the poles at infinity (capacitor loops). With R
 * an orthonormal basis of range(M) (Householder QR with column pivoting, rank r = number of finite
 * poles), M·R = R·K, and D·h split along null(M) as R·a + n, one finds
 *     H(s) = (h0 − gR·K⁻¹·a) + gR·K⁻¹·(sI − A)⁻¹·K⁻¹·a,   A = s0·I − K⁻¹,
 * so A, B = K⁻¹a, C = gR·K⁻¹ (D is read from the network equations at infinity by the caller).
 * Null when the decomposition does not hold to 1e-10 (a nilpotent block among the infinite modes).
 */
export interface StateModel {
	r: number;
	A: Float64Array;
	B: Float64Array;
	C: Float64Array;
	D: number;
}

/** Householder QR with column pivoting; returns Q (m×m, row-major). */
function pivotedQ(a0: Float64Array, m: number): Float64Array {
	const a = a0.slice();
	const Q = new Float64Array(m * m);
	for (let i = 0; i < m; i++) Q[i * m + i] = 1;
	const colNorm = (j: number, from: number) => {
		let s = 0;
		for (let i = from; i < m; i++) s += a[i * m + j] * a[i * m + j];
		return s;
	};
	const v = new Float64Array(m);
	for (let k = 0; k < m; k++) {
		let best = k;
		let bestN = colNorm(k, k);
		for (let j = k + 1; j < m; j++) {
			const nj = colNorm(j, k);
			if (nj > bestN) {
				best = j;
				bestN = nj;
			}
		}
		if (best !== k)
			for (let i = 0; i < m; i++) [a[i * m + k], a[i * m + best]] = [a[i * m + best], a[i * m + k]];
		const norm = Math.sqrt(bestN);
		if (norm === 0) break;
		const alpha = a[k * m + k] > 0 ? -norm : norm;
		v.fill(0);
		for (let i = k; i < m; i++) v[i] = a[i * m + k];
		v[k] -= alpha;
		let vv = 0;
		for (let i = k; i < m; i++) vv += v[i] * v[i];
		if (vv === 0) continue;
		// a ← (I − 2vvᵀ/vᵀv)·a, Q ← Q·(I − 2vvᵀ/vᵀv)
		for (let j = k; j < m; j++) {
			let s = 0;
			for (let i = k; i < m; i++) s += v[i] * a[i * m + j];
			s = (2 * s) / vv;
			for (let i = k; i < m; i++) a[i * m + j] -= s * v[i];
		}
		for (let i = 0; i < m; i++) {
			let s = 0;
			for (let l = k; l < m; l++) s += Q[i * m + l] * v[l];
			s = (2 * s) / vv;
			for (let l = k; l < m; l++) Q[i * m + l] -= s * v[l];
		}
	}
	return Q;
}

function transpose(a: Float64Array, m: number): Float64Array {
	const t = new Float64Array(m * m);
	for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) t[j * m + i] = a[i * m + j];
	return t;
}

export function stateModel(pm: PortModel, r: number, D: number): StateModel | null {
	const m = pm.m;
	const M = poleMatrix(pm);
	const dh = Float64Array.from(pm.h, (x, i) => x * pm.d[i]);
	// Columns 0…r−1 of R span range(M); N spans null(M) (the complement of range(Mᵀ)).
	let R: Float64Array;
	let a: Float64Array;
	if (r === m) {
		R = new Float64Array(m * m);
		for (let i = 0; i < m; i++) R[i * m + i] = 1;
		a = dh;
	} else {
		const Q1 = pivotedQ(M, m);
		const Q2 = pivotedQ(transpose(M, m), m);
		R = new Float64Array(m * r);
		for (let i = 0; i < m; i++) for (let j = 0; j < r; j++) R[i * r + j] = Q1[i * m + j];
		// [R N]·[a; c] = D·h
		const basis = new Float64Array(m * m);
		for (let i = 0; i < m; i++)
			for (let j = 0; j < m; j++) basis[i * m + j] = j < r ? Q1[i * m + j] : Q2[i * m + j];
		const rhs = new Float64Array(m * m);
		for (let i = 0; i < m; i++) rhs[i * m] = dh[i];
		const sol = solveMatrix(basis, rhs, m);
		if (!sol) return null;
		a = new Float64Array(r);
		for (let j = 0; j < r; j++) a[j] = sol[j * m];
	}
	const cols = r === m ? m : r;
	// K = Rᵀ·M·R and the invariance residual ‖M·R − R·K‖.
	const MR = new Float64Array(m * cols);
	for (let i = 0; i < m; i++)
		for (let j = 0; j < cols; j++) {
			let s = 0;
			for (let l = 0; l < m; l++) s += M[i * m + l] * R[l * cols + j];
			MR[i * cols + j] = s;
		}
	const K = new Float64Array(cols * cols);
	for (let i = 0; i < cols; i++)
		for (let j = 0; j < cols; j++) {
			let s = 0;
			for (let l = 0; l < m; l++) s += R[l * cols + i] * MR[l * cols + j];
			K[i * cols + j] = s;
		}
	let resid = 0;
	let scale = 0;
	for (let i = 0; i < m; i++)
		for (let j = 0; j < cols; j++) {
			let s = MR[i * cols + j];
			for (let l = 0; l < cols; l++) s -= R[i * cols + l] * K[l * cols + j];
			resid = Math.max(resid, Math.abs(s));
			scale = Math.max(scale, Math.abs(MR[i * cols + j]));
		}
	if (!(resid <= 1e-10 * scale)) return null;
	const I = new Float64Array(cols * cols);
	for (let i = 0; i < cols; i++) I[i * cols + i] = 1;
	const Kinv = solveMatrix(K, I, cols);
	if (!Kinv) return null;
	const A = new Float64Array(cols * cols);
	for (let i = 0; i < cols * cols; i++) A[i] = -Kinv[i];
	for (let i = 0; i < cols; i++) A[i * cols + i] += pm.s0;
	const B = new Float64Array(cols);
	const gR = new Float64Array(cols);
	for (let j = 0; j < cols; j++) for (let l = 0; l < m; l++) gR[j] += pm.g[l] * R[l * cols + j];
	const C = new Float64Array(cols);
	for (let i = 0; i < cols; i++)
		for (let j = 0; j < cols; j++) {
			B[i] += Kinv[i * cols + j] * a[j];
			C[j] += gR[i] * Kinv[i * cols + j];
		}
	return { r: cols, A, B, C, D };
}

/** D + C·(sI − A)⁻¹·B at s = j·w (the dense complex LU of complex-lu.ts, r×r). */
export function stateTransfer(sm: StateModel, w: number): { re: number; im: number } | null {
	const n = sm.r;
	const re = new Float64Array(n * n);
	const im = new Float64Array(n * n);
	for (let i = 0; i < n * n; i++) re[i] = -sm.A[i];
	for (let i = 0; i < n; i++) im[i * n + i] = w;
	const lu = cluFactor(re, im, n);
	if (lu.singular) return null;
	const xr = Float64Array.from(sm.B);
	const xi = new Float64Array(n);
	cluSolve(lu, xr, xi);
	let hr = sm.D;
	let hi = 0;
	for (let i = 0; i < n; i++) {
		hr += sm.C[i] * xr[i];
		hi += sm.C[i] * xi[i];
	}
	return { re: hr, im: hi };
}
