import type { Assembled } from './assemble';
import { applyQToRows, pivotedQR } from './kernels/pivoted-qr';
import { luSolve } from './lu';
import type { PortModel } from './port-model';
import { INFINITE_MU, portPair, type Spectrum, type SymmetricBasis } from './spectrum';
import { symmetricEigen } from './symmetric-eigen';

/**
 * The symmetric pole problem of an RC network set up on its nodes instead of its capacitor
 * ports. With A = G + s0·C (the N×N shifted network matrix, symmetric for a reciprocal network
 * though indefinite through source rows), P the ports' incidence vectors and D their
 * capacitances, the port path (spectrum.ts) diagonalizes the m×m
 *     S = D^½·Pᵀ·A⁻¹·P·D^½ = Fᵀ·A⁻¹·F,   F = P·D^½ (N×m).
 * Its rank is at most rank(F) ≤ N, and a mesh has more capacitors than nodes: every capacitor
 * loop adds an exact zero eigenvalue (a pole at infinity). Householder QR with column pivoting
 * of Fᵀ (Golub & Van Loan, Matrix Computations, §5.4.2) gives Fᵀ = Q₁·R̃ with Q₁ (m×r)
 * orthonormal, r = rank(F); then
 *     S = Q₁·T·Q₁ᵀ,   T = R̃·A⁻¹·R̃ᵀ (r×r, symmetric),
 * so S's non-zero eigenvalues are T's and its eigenvectors are Q₁·W for T = W·Λ·Wᵀ: XY and YX
 * share their non-zero eigenvalues (the standard fact behind XᵀX and XXᵀ), here with X = Q₁,
 * Y = T·Q₁ᵀ, YX = T, and Q₁ᵀQ₁ = I maps T's eigenvectors to S's. S vanishes on the complement of
 * range(Q₁) = range(Fᵀ), so its other m − r eigenvalues are exact zeros.
 * Every step is orthogonal or a backward-stable solve with the port model's own factors, so the
 * eigenvalues carry the same ε·‖S‖ absolute error as on the port path, at a fraction of its cost
 * when r is well below m: tridiagonalizing is cubic, (r/m)³ of the work, while the QR and the r
 * solves are quadratic in m.
 *
 * Null when it does not pay (rank close to m), does not apply, or T is singular (below); the
 * caller then takes the port path, which handles every case this one does.
 */
export function nodeSpaceSpectrum(a: Assembled, pm: PortModel): Spectrum | null {
	const { m, d, lu } = pm;
	if (!lu || m === 0) return null;
	for (let i = 0; i < m; i++) if (!(d[i] > 0) || !Number.isFinite(d[i])) return null;
	if (loopThroughSource(a)) return null; // T would be singular (below): skip the work
	const sqrtD = new Float64Array(m);
	for (let i = 0; i < m; i++) sqrtD[i] = Math.sqrt(d[i]);
	// Fᵀ's non-zero columns only: the unknowns some capacitor touches (not source currents).
	const column = new Map<number, number>();
	for (const p of a.ports)
		for (const [row] of p.vec) if (!column.has(row)) column.set(row, column.size);
	const n = column.size;
	if (n > PAYS_BELOW * m) return null;
	const unknown = Int32Array.from(column.keys());
	const x = new Float64Array(m * n);
	let big = 0;
	a.ports.forEach((p, j) => {
		for (const [row, val] of p.vec) x[column.get(row)! * m + j] += sqrtD[j] * val;
	});
	for (let c = 0; c < n; c++) {
		let s = 0;
		for (let j = 0; j < m; j++) s += x[c * m + j] * x[c * m + j];
		big = Math.max(big, Math.sqrt(s));
	}
	// Numerical rank at max(m, n)·ε relative to the largest column (common practice, as in the
	// rank functions of numerical libraries). A dependent column left in by rounding would add
	// an eigenvalue of order ε·‖S‖ to T, which hands the network to the port path below.
	const qr = pivotedQR(x, m, n, Math.max(m, n) * Number.EPSILON * big);
	const r = qr.rank;
	if (r > PAYS_BELOW * m) return null;
	// Y = A⁻¹·R̃ᵀ, one solve per row of R̃ = R₁·Πᵀ (row k: entries k … n − 1 in pivoted order).
	const N = a.size;
	const Y = new Float64Array(r * N);
	for (let k = 0; k < r; k++) {
		const y = Y.subarray(k * N, k * N + N);
		for (let j = k; j < n; j++) y[unknown[qr.perm[j]]] = qr.r[k * n + j];
		luSolve(lu, y);
	}
	// T = R̃·Y, symmetrized: its asymmetry is the solves' round-off (as H's on the port path).
	// Y's columns are first gathered in pivoted order, so both factors are read contiguously.
	const Yp = new Float64Array(r * n);
	for (let k = 0; k < r; k++)
		for (let j = 0; j < n; j++) Yp[k * n + j] = Y[k * N + unknown[qr.perm[j]]];
	const T = new Float64Array(r * r);
	for (let l = 0; l < r; l++) {
		for (let k = 0; k < r; k++) {
			let t = 0;
			for (let j = l; j < n; j++) t += qr.r[l * n + j] * Yp[k * n + j];
			T[l * r + k] = t;
		}
	}
	for (let l = 0; l < r; l++) {
		for (let k = 0; k < l; k++) {
			const t = 0.5 * (T[l * r + k] + T[k * r + l]);
			T[l * r + k] = t;
			T[k * r + l] = t;
		}
	}
	const eig = symmetricEigen(T, r);
	if (!eig) return null;
	const mu = { re: new Float64Array(m), im: new Float64Array(m) };
	mu.re.set(eig.values);
	let max = 0;
	for (let i = 0; i < r; i++) max = Math.max(max, Math.abs(eig.values[i]));
	const kept: number[] = [];
	for (let k = 0; k < r; k++) if (Math.abs(eig.values[k]) > INFINITE_MU * max) kept.push(k);
	// T itself singular: a capacitor loop through a voltage source (a capacitor across the input,
	// or a coupling capacitor from it), a mode at infinity inside range(Fᵀ). Its vector comes out
	// of the eigensolver mixed with the fastest finite modes (the gap is ε·‖T‖), and the deflated
	// zero problem reads that mixing: a zero 10⁷ times the shift came out 80 % off on a ten-decade
	// network. The port path resolves such a network as well as it ever did.
	if (kept.length < r) return null;
	// Port-space eigenvectors Q₁·w, all at once.
	const V = new Float64Array(r * m);
	kept.forEach((k, t) => V.set(eig.vectors.subarray(k * r, k * r + r), t * m));
	applyQToRows(qr, V, r);
	const s: Spectrum['s'] = kept.map((k, t) => {
		const muk = eig.values[k];
		const vectors = portPair(V.subarray(t * m, t * m + m), sqrtD);
		return { re: pm.s0 - 1 / muk, im: 0, muRe: muk, muIm: 0, vectors };
	});
	const basis: SymmetricBasis = {
		values: Float64Array.from(kept, (k) => eig.values[k]),
		vectors: V,
		sqrtD,
		// The infinite modes span the complement of range(Fᵀ) = range(Q₁). The readings this is
		// asked about, u = D^½·h/h0 and w = D^½·g, are D^½·Pᵀ·A⁻¹·b/h0 = Fᵀ·(A⁻¹b)/h0 and
		// Fᵀ·A⁻ᵀ·c (port-model.ts): both lie in range(Fᵀ), so their product over the complement
		// is exactly zero, for any network.
		infiniteProduct: () => 0
	};
	return { hs: null, s, mu, s0: pm.s0, basis };
}

/**
 * Whether a loop of capacitors closes through a voltage source, read from the structure so the
 * node path is not tried in vain (the singular-T check after the eigensolve stays the guarantee).
 * On this path (symmetric equations, every d > 0: no inductor, controlled source or op-amp) an
 * unknown with a zero diagonal whose row holds only ±1 entries is a voltage source's branch
 * (modified nodal analysis), joining the one or two nodes it has entries in. Capacitor edges
 * are joined first; a source edge whose ends are already joined closes such a loop.
 */
function loopThroughSource(a: Assembled): boolean {
	const n = a.size;
	const parent = Int32Array.from({ length: n + 1 }, (_, i) => i); // n: ground
	const find = (x: number): number => {
		while (parent[x] !== x) x = parent[x] = parent[parent[x]];
		return x;
	};
	const join = (x: number, y: number): boolean => {
		const [rx, ry] = [find(x), find(y)];
		if (rx === ry) return false;
		parent[rx] = ry;
		return true;
	};
	for (const { vec } of a.ports) if (vec.length) join(vec[0][0], vec.length > 1 ? vec[1][0] : n);
	for (let b = 0; b < n; b++) {
		if (a.g[b * n + b] !== 0) continue;
		const ends: number[] = [];
		let branch = true;
		for (let j = 0; j < n && branch; j++) {
			const v = a.g[b * n + j];
			if (v === 0) continue;
			if (Math.abs(v) !== 1 || ends.length === 2) branch = false;
			else ends.push(j);
		}
		if (branch && ends.length > 0 && !join(ends[0], ends.length > 1 ? ends[1] : n)) return true;
	}
	return false;
}

/**
 * Rank fraction r/m below which the node path pays. Measured on RC chains with extra floating
 * capacitors (m = 30 … 600 ports, r/m = 0.5 … 0.9; Node 20, one core): at r/m = 0.5 it takes
 * 0.5–0.7 of the port path's time, at 0.6 about 0.7–0.85, and it breaks even between 0.7 (small
 * m) and 0.8 (m = 600), where the QR and the back-transformation catch up with the saved
 * tridiagonalization.
 */
const PAYS_BELOW = 0.65;
