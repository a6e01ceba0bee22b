import { symmetricEigen } from '../symmetric-eigen';

/**
 * The k largest eigenvalues of a symmetric operator (given only as y = S·x) with their
 * eigenvectors: Lanczos with full reorthogonalization and thick restarts (Wu and Simon,
 * "Thick-restart Lanczos method for large symmetric eigenvalue problems", SIAM J. Matrix Anal.
 * Appl. 22(2), 2000 — the symmetric case of Stewart's Krylov–Schur restart, and mathematically
 * the implicitly restarted Lanczos of Sorensen 1992 with exact shifts).
 *
 * Used in shift-and-invert form, S = R⁻¹·C·R⁻ᵀ with K = R·Rᵀ, the largest eigenvalues are the
 * natural frequencies nearest the shift; they are well separated relative to the spectrum's
 * spread, so a basis of about 2k + 20 vectors converges in a few restarts.
 *
 * Bounded: at most `maxRestarts` restarts, with a non-finite check on every vector; the result
 * says which pairs met the tolerance (‖S·y − θ·y‖ ≤ tol·|θ_max|).
 */
export interface SymmetricEigenResult {
	values: Float64Array;
	/** vectors[i] is the unit eigenvector of values[i]. */
	vectors: Float64Array[];
	/** Residual estimate ‖S·y − θ·y‖ / |θ_max| per pair. */
	residuals: Float64Array;
	converged: boolean;
	/** Operator applications. */
	applications: number;
}

export interface LanczosOptions {
	k: number;
	/** Basis size (default max(2k + 20, 30), at most n). */
	basis?: number;
	tol?: number;
	maxRestarts?: number;
	/** Start vector (a deterministic one is used otherwise, so results repeat). */
	start?: Float64Array;
	/** Called after every restart with the number of converged pairs (progress). */
	onRestart?: (converged: number) => void;
}

export function largestEigenpairs(
	n: number,
	apply: (x: Float64Array, y: Float64Array) => void,
	o: LanczosOptions
): SymmetricEigenResult {
	const k = Math.min(o.k, n);
	const m = Math.min(n, o.basis ?? Math.max(2 * k + 20, 30));
	const tol = o.tol ?? 1e-13;
	const maxRestarts = o.maxRestarts ?? 100;
	const V: Float64Array[] = [];
	const T = new Float64Array(m * m);
	let v = o.start ? o.start.slice() : startVector(n);
	normalize(v);
	let kept = 0;
	let applications = 0;
	const w = new Float64Array(n);
	let theta = new Float64Array(0);
	let Y = new Float64Array(0);
	let beta = 0;
	let converged = false;
	let residuals = new Float64Array(k);
	for (let restart = 0; restart <= maxRestarts; restart++) {
		V.length = kept;
		V.push(v);
		let size = m;
		for (let j = kept; j < m; j++) {
			apply(V[j], w);
			applications++;
			// Full reorthogonalization, twice (Daniel, Gragg, Kaufman and Stewart, 1976): the
			// projected matrix is then Vᵀ·S·V to working precision, whatever the restarts kept.
			for (let pass = 0; pass < 2; pass++)
				for (let i = 0; i <= j; i++) {
					const h = dot(V[i], w);
					T[i * m + j] += h;
					if (i !== j) T[j * m + i] += h;
					axpy(-h, V[i], w);
				}
			beta = Math.sqrt(dot(w, w));
			if (!Number.isFinite(beta)) throw new Error('non-finite vector in the Lanczos iteration');
			if (j + 1 === m) break;
			if (beta <= 1e-14 * Math.abs(T[j * m + j]) || beta === 0) {
				// An invariant subspace: the pairs found so far are exact.
				size = j + 1;
				beta = 0;
				break;
			}
			const next = new Float64Array(n);
			for (let i = 0; i < n; i++) next[i] = w[i] / beta;
			V.push(next);
		}
		const small = new Float64Array(size * size);
		for (let i = 0; i < size; i++)
			for (let j = 0; j < size; j++) small[i * size + j] = T[i * m + j];
		const eig = symmetricEigen(small, size);
		if (!eig) throw new Error('the projected eigenproblem did not converge');
		const order = Array.from(eig.values.keys()).sort((a, b) => eig.values[b] - eig.values[a]);
		theta = Float64Array.from(order, (i) => eig.values[i]);
		Y = new Float64Array(size * size);
		order.forEach((src, dst) =>
			Y.set(eig.vectors.subarray(src * size, src * size + size), dst * size)
		);
		const scale = Math.abs(theta[0]) || 1;
		const want = Math.min(k, size);
		residuals = new Float64Array(want);
		let done = 0;
		for (let i = 0; i < want; i++) {
			residuals[i] = Math.abs(beta * Y[i * size + size - 1]) / scale;
			if (residuals[i] <= tol) done++;
		}
		o.onRestart?.(done);
		if (done === want || beta === 0 || size < m) {
			converged = done === want;
			return finish(V, Y, size, theta, want, residuals, converged, applications, n);
		}
		// Thick restart: keep the wanted Ritz vectors and a few more, plus the residual direction.
		kept = Math.min(size - 1, want + Math.max(2, Math.floor((m - want) / 3)));
		const Vk: Float64Array[] = [];
		for (let i = 0; i < kept; i++) Vk.push(combine(V, Y, i, size, n));
		// The kept block is diagonal; its coupling to the residual direction (β times the Ritz
		// vectors' last components) comes out of the projection of the next column.
		T.fill(0);
		for (let i = 0; i < kept; i++) T[i * m + i] = theta[i];
		v = new Float64Array(n);
		for (let i = 0; i < n; i++) v[i] = w[i] / beta;
		V.length = 0;
		V.push(...Vk);
	}
	return finish(
		V,
		Y,
		Math.sqrt(Y.length),
		theta,
		Math.min(k, theta.length),
		residuals,
		false,
		applications,
		n
	);
}

function finish(
	V: Float64Array[],
	Y: Float64Array,
	size: number,
	theta: Float64Array,
	want: number,
	residuals: Float64Array,
	converged: boolean,
	applications: number,
	n: number
): SymmetricEigenResult {
	const vectors: Float64Array[] = [];
	for (let i = 0; i < want; i++) vectors.push(combine(V, Y, i, size, n));
	return { values: theta.slice(0, want), vectors, residuals, converged, applications };
}

/** Ritz vector i: Σ_j V[j]·Y(i, j). */
function combine(
	V: Float64Array[],
	Y: Float64Array,
	i: number,
	size: number,
	n: number
): Float64Array {
	const out = new Float64Array(n);
	for (let j = 0; j < size; j++) axpy(Y[i * size + j], V[j], out);
	return out;
}

export function dot(a: Float64Array, b: Float64Array): number {
	let s = 0;
	for (let i = 0; i < a.length; i++) s += a[i] * b[i];
	return s;
}

export function axpy(alpha: number, x: Float64Array, y: Float64Array): void {
	if (alpha === 0) return;
	for (let i = 0; i < x.length; i++) y[i] += alpha * x[i];
}

export function normalize(x: Float64Array): number {
	const s = Math.sqrt(dot(x, x));
	if (s > 0) for (let i = 0; i < x.length; i++) x[i] /= s;
	return s;
}

/** A fixed, non-degenerate start vector: positive (it overlaps every non-negative mode) with
 *  a deterministic ripple, so results repeat run to run. */
export function startVector(n: number): Float64Array {
	const v = new Float64Array(n);
	let s = 12345;
	for (let i = 0; i < n; i++) {
		s = (s * 1664525 + 1013904223) >>> 0;
		v[i] = 1 + s / 2 ** 32;
	}
	return v;
}
