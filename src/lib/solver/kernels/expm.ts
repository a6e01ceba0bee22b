/**
 * Matrix exponential by scaling and squaring with diagonal Padé approximants: Higham, "The
 * scaling and squaring method for the matrix exponential revisited", SIAM J. Matrix Anal. Appl.
 * 26(4), 2005, Algorithm 2.3: the lowest degree m ∈ {3, 5, 7, 9} whose θ_m bounds ‖A‖₁, else
 * scale A by 2^-s so ‖A‖₁ ≤ θ₁₃ = 5.37…, evaluate r₁₃ = q⁻¹p and square s times. Its backward error is below the unit roundoff for every
 * A; no eigenvectors are involved, so repeated and nearly repeated eigenvalues (a fourfold pole,
 * a doublet) are no harder than distinct ones. Row-major n×n Float64Arrays.
 */
const B13 = [
	64764752532480000, 32382376266240000, 7771770303897600, 1187353796428800, 129060195264000,
	10559470521600, 670442572800, 33522128640, 1323241920, 40840800, 960960, 16380, 182, 1
];
const THETA13 = 5.371920351148152;
/** Lower degrees with their θ_m (Higham 2005, Table 2.3) and coefficients. */
const LOW: { theta: number; b: number[] }[] = [
	{ theta: 1.495585217958292e-2, b: [120, 60, 12, 1] },
	{ theta: 2.53939833006323e-1, b: [30240, 15120, 3360, 420, 30, 1] },
	{ theta: 9.504178996162932e-1, b: [17297280, 8648640, 1995840, 277200, 25200, 1512, 56, 1] },
	{
		theta: 2.097847961257068,
		b: [17643225600, 8821612800, 2075673600, 302702400, 30270240, 2162160, 110880, 3960, 90, 1]
	}
];

export function matmul(a: Float64Array, b: Float64Array, n: number): Float64Array {
	const c = new Float64Array(n * n);
	for (let i = 0; i < n; i++)
		for (let k = 0; k < n; k++) {
			const x = a[i * n + k];
			if (x === 0) continue;
			const rowB = k * n;
			const rowC = i * n;
			for (let j = 0; j < n; j++) c[rowC + j] += x * b[rowB + j];
		}
	return c;
}

function norm1(a: Float64Array, n: number): number {
	let best = 0;
	for (let j = 0; j < n; j++) {
		let s = 0;
		for (let i = 0; i < n; i++) s += Math.abs(a[i * n + j]);
		best = Math.max(best, s);
	}
	return best;
}

/** Solves Q·X = P (n×n, partial pivoting); null when Q is singular or not finite. */
export function solveMatrix(q: Float64Array, p: Float64Array, n: number): Float64Array | null {
	const a = q.slice();
	const x = p.slice();
	for (let k = 0; k < n; k++) {
		let piv = k;
		for (let i = k + 1; i < n; i++) if (Math.abs(a[i * n + k]) > Math.abs(a[piv * n + k])) piv = i;
		const d = a[piv * n + k];
		if (d === 0 || !Number.isFinite(d)) return null;
		if (piv !== k)
			for (let j = 0; j < n; j++) {
				[a[k * n + j], a[piv * n + j]] = [a[piv * n + j], a[k * n + j]];
				[x[k * n + j], x[piv * n + j]] = [x[piv * n + j], x[k * n + j]];
			}
		for (let i = k + 1; i < n; i++) {
			const f = a[i * n + k] / d;
			if (f === 0) continue;
			for (let j = k; j < n; j++) a[i * n + j] -= f * a[k * n + j];
			for (let j = 0; j < n; j++) x[i * n + j] -= f * x[k * n + j];
		}
	}
	for (let k = n - 1; k >= 0; k--) {
		const d = a[k * n + k];
		for (let j = 0; j < n; j++) {
			let s = x[k * n + j];
			for (let i = k + 1; i < n; i++) s -= a[k * n + i] * x[i * n + j];
			x[k * n + j] = s / d;
		}
	}
	return x;
}

/** r_m(A) = q⁻¹p for a degree m < 13: U = A·Σ b_{2k+1}A^{2k}, V = Σ b_{2k}A^{2k}. */
function lowDegree(a: Float64Array, n: number, b: number[]): Float64Array | null {
	const I = new Float64Array(n * n);
	for (let i = 0; i < n; i++) I[i * n + i] = 1;
	const A2 = matmul(a, a, n);
	const powers = [I, A2];
	for (let k = 2; 2 * k < b.length; k++) powers.push(matmul(powers[k - 1], A2, n));
	const odd = new Float64Array(n * n);
	const V = new Float64Array(n * n);
	powers.forEach((p, k) => {
		for (let i = 0; i < n * n; i++) {
			V[i] += b[2 * k] * p[i];
			if (2 * k + 1 < b.length) odd[i] += b[2 * k + 1] * p[i];
		}
	});
	const U = matmul(a, odd, n);
	const P = new Float64Array(n * n);
	const Q = new Float64Array(n * n);
	for (let i = 0; i < n * n; i++) {
		P[i] = V[i] + U[i];
		Q[i] = V[i] - U[i];
	}
	return solveMatrix(Q, P, n);
}

/** e^A for a row-major n×n A; null when A is not finite or the Padé denominator is singular. */
export function expm(a: Float64Array, n: number): Float64Array | null {
	const nrm = norm1(a, n);
	if (!Number.isFinite(nrm)) return null;
	const low = LOW.find((l) => nrm <= l.theta);
	if (low) return lowDegree(a, n, low.b);
	const s = nrm > THETA13 ? Math.max(0, Math.ceil(Math.log2(nrm / THETA13))) : 0;
	const scale = 2 ** -s;
	const A = a.map((x) => x * scale);
	const I = new Float64Array(n * n);
	for (let i = 0; i < n; i++) I[i * n + i] = 1;
	const A2 = matmul(A, A, n);
	const A4 = matmul(A2, A2, n);
	const A6 = matmul(A4, A2, n);
	const b = B13;
	const lin = (c: number[], ms: Float64Array[]) => {
		const out = new Float64Array(n * n);
		ms.forEach((m, k) => {
			if (c[k] !== 0) for (let i = 0; i < n * n; i++) out[i] += c[k] * m[i];
		});
		return out;
	};
	// U = A·[A6(b13 A6 + b11 A4 + b9 A2) + b7 A6 + b5 A4 + b3 A2 + b1 I]
	const u1 = matmul(A6, lin([b[13], b[11], b[9]], [A6, A4, A2]), n);
	const U = matmul(A, lin([1, b[7], b[5], b[3], b[1]], [u1, A6, A4, A2, I]), n);
	// V = A6(b12 A6 + b10 A4 + b8 A2) + b6 A6 + b4 A4 + b2 A2 + b0 I
	const v1 = matmul(A6, lin([b[12], b[10], b[8]], [A6, A4, A2]), n);
	const V = lin([1, b[6], b[4], b[2], b[0]], [v1, A6, A4, A2, I]);
	const P = new Float64Array(n * n);
	const Q = new Float64Array(n * n);
	for (let i = 0; i < n * n; i++) {
		P[i] = V[i] + U[i];
		Q[i] = V[i] - U[i];
	}
	let R = solveMatrix(Q, P, n);
	if (!R) return null;
	for (let k = 0; k < s; k++) R = matmul(R, R, n);
	for (let i = 0; i < n * n; i++) if (!Number.isFinite(R[i])) return null;
	return R;
}
