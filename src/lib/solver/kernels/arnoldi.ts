import { hessenberg, hqr } from '../eigen';
import { eigenvectors } from '../eigenvectors';
import { axpy, dot, normalize, startVector } from './lanczos';

/**
 * The k eigenvalues of largest magnitude of a real non-symmetric operator (given as y = A·x),
 * with eigenvectors: implicitly restarted Arnoldi (Sorensen, "Implicit application of polynomial
 * filters in a k-step Arnoldi method", SIAM J. Matrix Anal. Appl. 13(1), 1992; the ARPACK Users'
 * Guide, Lehoucq, Sorensen and Yang, SIAM 1998). The basis is extended to m vectors (full
 * reorthogonalization, twice), the unwanted Ritz values are applied as exact shifts — real ones
 * by a shifted QR step, complex-conjugate pairs by one real double-shift step — and the
 * factorization is truncated back to the wanted size, so the start vector is filtered towards
 * the wanted invariant subspace without ever restarting from scratch.
 *
 * Complex pairs are kept together (k grows by one when the k-th value would split a pair).
 * Bounded by `maxRestarts`; convergence is ‖A·y − θ·y‖ ≤ tol·|θ| (ARPACK's criterion).
 */
export interface ArnoldiResult {
	re: Float64Array;
	im: Float64Array;
	/** Eigenvectors, unit 2-norm, real and imaginary parts. */
	vr: Float64Array[];
	vi: Float64Array[];
	residuals: Float64Array;
	converged: boolean;
	applications: number;
}

export interface ArnoldiOptions {
	k: number;
	basis?: number;
	tol?: number;
	maxRestarts?: number;
	onRestart?: (converged: number) => void;
}

interface Ritz {
	re: number;
	im: number;
	xr: Float64Array;
	xi: Float64Array;
	residual: number;
}

export function largestMagnitudeEigenpairs(
	n: number,
	apply: (x: Float64Array, y: Float64Array) => void,
	o: ArnoldiOptions
): ArnoldiResult {
	const k0 = Math.min(o.k, n);
	const m = Math.min(n, o.basis ?? Math.max(2 * k0 + 20, 30));
	const tol = o.tol ?? 1e-12;
	const maxRestarts = o.maxRestarts ?? 150;
	const V: Float64Array[] = [normalizeCopy(startVector(n))];
	// H is (m+1)×m, row-major with row length m.
	let H = new Float64Array((m + 1) * m);
	const w = new Float64Array(n);
	let applications = 0;
	let size = 0;
	let ritz: Ritz[] = [];
	let want = k0;
	for (let restart = 0; restart <= maxRestarts; restart++) {
		let invariant = false;
		for (let j = size; j < m; j++) {
			apply(V[j], w);
			applications++;
			for (let pass = 0; pass < 2; pass++)
				for (let i = 0; i <= j; i++) {
					const h = dot(V[i], w);
					H[i * m + j] += h;
					axpy(-h, V[i], w);
				}
			const beta = Math.sqrt(dot(w, w));
			if (!Number.isFinite(beta)) throw new Error('non-finite vector in the Arnoldi iteration');
			H[(j + 1) * m + j] = beta;
			size = j + 1;
			if (beta <= 1e-14 * Math.abs(H[j * m + j]) || beta === 0) {
				invariant = true;
				H[(j + 1) * m + j] = 0;
				break;
			}
			V[j + 1] = new Float64Array(n);
			for (let i = 0; i < n; i++) V[j + 1][i] = w[i] / beta;
		}
		const beta = H[size * m + size - 1];
		ritz = ritzPairs(H, m, size, beta);
		want = Math.min(k0, ritz.length);
		// Keep complex-conjugate pairs together.
		if (want < ritz.length && ritz[want - 1].im !== 0 && ritz[want].im === -ritz[want - 1].im)
			want++;
		let done = 0;
		for (let i = 0; i < want; i++)
			if (ritz[i].residual <= tol * Math.hypot(ritz[i].re, ritz[i].im)) done++;
		o.onRestart?.(done);
		if (done === want || invariant || size < m || want >= size - 1 || restart === maxRestarts) {
			return finish(V, ritz, want, size, done === want || invariant, applications, n);
		}
		// Exact shifts: the unwanted Ritz values, applied to Hm with Q accumulated.
		const Hm = new Float64Array(size * size);
		for (let i = 0; i < size; i++) for (let j = 0; j < size; j++) Hm[i * size + j] = H[i * m + j];
		const Q = identity(size);
		for (let i = want; i < ritz.length; i++) {
			const r = ritz[i];
			if (r.im !== 0) {
				if (r.im < 0) continue; // its conjugate is applied with it
				doubleShiftStep(Hm, Q, size, r.re, r.im);
			} else singleShiftStep(Hm, Q, size, r.re);
		}
		// New residual: f = v_{kk}·Hm(kk, kk−1) + f_m·Q(m−1, kk−1), then truncate to kk vectors.
		const kk = want;
		const sigma = Q[(size - 1) * size + kk - 1];
		const bk = Hm[kk * size + kk - 1];
		const Vq: Float64Array[] = [];
		for (let c = 0; c <= kk; c++) {
			const out = new Float64Array(n);
			for (let j = 0; j < size; j++) axpy(Q[j * size + c], V[j], out);
			Vq.push(out);
		}
		const f = new Float64Array(n);
		axpy(bk, Vq[kk], f);
		axpy(beta * sigma, V[size], f);
		const fn = Math.sqrt(dot(f, f));
		H = new Float64Array((m + 1) * m);
		for (let i = 0; i < kk; i++)
			for (let j = Math.max(0, i - 1); j < kk; j++) H[i * m + j] = Hm[i * size + j];
		V.length = 0;
		V.push(...Vq.slice(0, kk));
		if (!(fn > 0)) return finish(V, ritz, want, size, false, applications, n);
		H[kk * m + kk - 1] = fn;
		for (let i = 0; i < n; i++) f[i] /= fn;
		V.push(f);
		size = kk;
	}
	return finish(V, ritz, want, size, false, applications, n);
}

/** Ritz values of the leading size×size block, by decreasing magnitude, with residual bounds. */
function ritzPairs(H: Float64Array, m: number, size: number, beta: number): Ritz[] {
	const Hm = new Float64Array(size * size);
	for (let i = 0; i < size; i++) for (let j = 0; j < size; j++) Hm[i * size + j] = H[i * m + j];
	const hs = hessenberg(Hm, size, true);
	const ev = hqr(hs);
	const out: Ritz[] = [];
	for (let i = 0; i < size; i++) {
		const { xr, xi } = eigenvectors(hs, ev.re[i], ev.im[i]);
		let nrm = 0;
		for (let j = 0; j < size; j++) nrm += xr[j] * xr[j] + xi[j] * xi[j];
		nrm = Math.sqrt(nrm) || 1;
		const last = Math.hypot(xr[size - 1], xi[size - 1]) / nrm;
		out.push({
			re: ev.re[i],
			im: ev.im[i],
			xr: xr.map((x) => x / nrm),
			xi: xi.map((x) => x / nrm),
			residual: Math.abs(beta) * last
		});
	}
	out.sort((a, b) => Math.hypot(b.re, b.im) - Math.hypot(a.re, a.im) || b.im - a.im);
	return out;
}

function finish(
	V: Float64Array[],
	ritz: Ritz[],
	want: number,
	size: number,
	converged: boolean,
	applications: number,
	n: number
): ArnoldiResult {
	const re = new Float64Array(want);
	const im = new Float64Array(want);
	const residuals = new Float64Array(want);
	const vr: Float64Array[] = [];
	const vi: Float64Array[] = [];
	for (let i = 0; i < want; i++) {
		const r = ritz[i];
		re[i] = r.re;
		im[i] = r.im;
		residuals[i] = r.residual / Math.max(Math.hypot(r.re, r.im), 1e-300);
		const a = new Float64Array(n);
		const b = new Float64Array(n);
		for (let j = 0; j < size; j++) {
			axpy(r.xr[j], V[j], a);
			axpy(r.xi[j], V[j], b);
		}
		const s = Math.sqrt(dot(a, a) + dot(b, b)) || 1;
		for (let t = 0; t < n; t++) {
			a[t] /= s;
			b[t] /= s;
		}
		vr.push(a);
		vi.push(b);
	}
	return { re, im, vr, vi, residuals, converged, applications };
}

function normalizeCopy(v: Float64Array): Float64Array {
	normalize(v);
	return v;
}

function identity(n: number): Float64Array {
	const q = new Float64Array(n * n);
	for (let i = 0; i < n; i++) q[i * n + i] = 1;
	return q;
}

/** One QR step with real shift μ on the Hessenberg H (Givens rotations), Q ← Q·G. */
function singleShiftStep(H: Float64Array, Q: Float64Array, n: number, mu: number): void {
	for (let i = 0; i < n; i++) H[i * n + i] -= mu;
	const cs = new Float64Array(n);
	const sn = new Float64Array(n);
	for (let i = 0; i < n - 1; i++) {
		const a = H[i * n + i];
		const b = H[(i + 1) * n + i];
		const r = Math.hypot(a, b);
		const c = r === 0 ? 1 : a / r;
		const s = r === 0 ? 0 : b / r;
		cs[i] = c;
		sn[i] = s;
		for (let j = i; j < n; j++) {
			const x = H[i * n + j];
			const y = H[(i + 1) * n + j];
			H[i * n + j] = c * x + s * y;
			H[(i + 1) * n + j] = -s * x + c * y;
		}
	}
	for (let i = 0; i < n - 1; i++) {
		const c = cs[i];
		const s = sn[i];
		for (let r = 0; r <= Math.min(i + 1, n - 1); r++) rotateCols(H, n, r, i, c, s);
		for (let r = 0; r < n; r++) rotateCols(Q, n, r, i, c, s);
	}
	for (let i = 0; i < n; i++) H[i * n + i] += mu;
	for (let i = 2; i < n; i++) for (let j = 0; j < i - 1; j++) H[i * n + j] = 0;
}

function rotateCols(A: Float64Array, n: number, r: number, i: number, c: number, s: number): void {
	const x = A[r * n + i];
	const y = A[r * n + i + 1];
	A[r * n + i] = c * x + s * y;
	A[r * n + i + 1] = -s * x + c * y;
}

/**
 * One real double-shift step for the pair a ± ib: Householder QR of
 * M = H² − 2a·H + (a² + b²)·I gives the orthogonal Z; H ← Zᵀ·H·Z, Q ← Q·Z. Done explicitly on
 * the small projected matrix (m ≤ a few dozen), then the round-off below the subdiagonal is
 * cleared.
 */
function doubleShiftStep(H: Float64Array, Q: Float64Array, n: number, a: number, b: number): void {
	const M = new Float64Array(n * n);
	const t = a * a + b * b;
	for (let i = 0; i < n; i++)
		for (let j = 0; j < n; j++) {
			let s = 0;
			for (let l = Math.max(0, i - 1); l <= Math.min(n - 1, j + 1); l++)
				s += H[i * n + l] * H[l * n + j];
			M[i * n + j] = s - 2 * a * H[i * n + j] + (i === j ? t : 0);
		}
	const v = new Float64Array(n);
	for (let c = 0; c < n - 1; c++) {
		const end = Math.min(n, c + 3);
		let norm = 0;
		for (let i = c; i < end; i++) norm += M[i * n + c] * M[i * n + c];
		norm = Math.sqrt(norm);
		if (norm === 0) continue;
		const alpha = M[c * n + c] > 0 ? -norm : norm;
		v.fill(0);
		for (let i = c; i < end; i++) v[i] = M[i * n + c];
		v[c] -= alpha;
		let vv = 0;
		for (let i = c; i < end; i++) vv += v[i] * v[i];
		if (vv === 0) continue;
		const reflect = (A: Float64Array, rowsFirst: boolean) => {
			if (rowsFirst) {
				// A ← P·A (P = I − 2vvᵀ/vᵀv), rows c … end−1.
				for (let j = 0; j < n; j++) {
					let s = 0;
					for (let i = c; i < end; i++) s += v[i] * A[i * n + j];
					s = (2 * s) / vv;
					for (let i = c; i < end; i++) A[i * n + j] -= s * v[i];
				}
			} else {
				// A ← A·P, columns c … end−1.
				for (let r = 0; r < n; r++) {
					let s = 0;
					for (let i = c; i < end; i++) s += A[r * n + i] * v[i];
					s = (2 * s) / vv;
					for (let i = c; i < end; i++) A[r * n + i] -= s * v[i];
				}
			}
		};
		reflect(M, true);
		reflect(H, true);
		reflect(H, false);
		reflect(Q, false);
	}
	for (let i = 2; i < n; i++) for (let j = 0; j < i - 1; j++) H[i * n + j] = 0;
}
