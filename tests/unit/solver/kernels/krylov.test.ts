import { describe, expect, test } from 'vitest';
import * as math from 'mathjs';
import { Triplets, cscFromTriplets, multiply } from '../../../../src/lib/solver/kernels/csc';
import { ldl, ldlSolve } from '../../../../src/lib/solver/kernels/ldl';
import { largestEigenpairs } from '../../../../src/lib/solver/kernels/lanczos';
import { largestMagnitudeEigenpairs } from '../../../../src/lib/solver/kernels/arnoldi';
import { luSolveSparse, sparseLu } from '../../../../src/lib/solver/kernels/sparse-lu';

/**
 * T = tridiag(−1, 2, −1) of order n with the last diagonal entry 1 (fixed at one end, free at
 * the other). Its eigenvalues are λ_j = 4·sin²((2j − 1)π / (2(2n + 1))), j = 1…n — a classical
 * closed form (e.g. W.-C. Yueh, "Eigenvalues of several tridiagonal matrices", Applied
 * Mathematics E-Notes 5, 2005, the case with one corner perturbed; stated here from memory and
 * checked numerically against mathjs for small n in the first test below).
 */
const lambda = (j: number, n: number) =>
	4 * Math.sin(((2 * j - 1) * Math.PI) / (2 * (2 * n + 1))) ** 2;

function fixedFree(n: number) {
	const t = new Triplets(n);
	for (let i = 0; i < n; i++) {
		t.add(i, i, i === n - 1 ? 1 : 2);
		if (i + 1 < n) {
			t.add(i, i + 1, -1);
			t.add(i + 1, i, -1);
		}
	}
	const excess = new Float64Array(n);
	excess[0] = 1;
	return { a: cscFromTriplets(t), excess };
}

describe(
	'shift-invert Lanczos against the closed-form eigenvalues of the fixed–free tridiagonal',
	{ timeout: 30_000 },
	() => {
		test('the closed form itself matches mathjs eigs for n = 12', () => {
			const n = 12;
			const dense = Array.from({ length: n }, (_, i) =>
				Array.from({ length: n }, (_, j) =>
					i === j ? (i === n - 1 ? 1 : 2) : Math.abs(i - j) === 1 ? -1 : 0
				)
			);
			const vals = (math.eigs(dense).values as number[]).slice().sort((a, b) => a - b);
			vals.forEach((v, i) =>
				expect(Math.abs(v - lambda(i + 1, n)) / lambda(i + 1, n)).toBeLessThan(1e-12)
			);
		});

		for (const n of [50, 2000]) {
			test(`n = ${n}: the 10 smallest eigenvalues (largest of T⁻¹) to 1e-12, with converged vectors`, () => {
				const { a, excess } = fixedFree(n);
				const f = ldl(a, excess);
				expect(f.accurate).toBe(true);
				const r = largestEigenpairs(n, (x, y) => (y.set(x), ldlSolve(f, y)), { k: 10 });
				expect(r.converged).toBe(true);
				for (let j = 1; j <= 10; j++) {
					const mu = r.values[j - 1];
					expect(Math.abs(1 / mu - lambda(j, n)) / lambda(j, n)).toBeLessThan(1e-12);
					// The vector: ‖T·v − λ·v‖ small relative to ‖T‖ = 4.
					const tv = multiply(a, r.vectors[j - 1], new Float64Array(n));
					let res = 0;
					for (let i = 0; i < n; i++)
						res = Math.max(res, Math.abs(tv[i] - r.vectors[j - 1][i] / mu));
					expect(res / 4).toBeLessThan(1e-12);
				}
			});
		}

		test('k larger than n returns every eigenvalue (an invariant subspace)', () => {
			const { a } = fixedFree(5);
			const f = ldl(a);
			const r = largestEigenpairs(5, (x, y) => (y.set(x), ldlSolve(f, y)), { k: 10 });
			expect(r.values.length).toBe(5);
			for (let j = 1; j <= 5; j++)
				expect(Math.abs(1 / r.values[j - 1] - lambda(j, 5))).toBeLessThan(1e-12);
		});
	}
);

describe(
	'implicitly restarted Arnoldi against mathjs eigs (dense, independent)',
	{ timeout: 30_000 },
	() => {
		test('random non-symmetric 36×36 with complex pairs, basis of 18 (so it restarts): the 8 of largest magnitude to 1e-9', () => {
			let s = 17;
			const r = () => (s = (s * 1664525 + 1013904223) >>> 0) / 2 ** 32;
			const n = 36;
			const dense = Array.from({ length: n }, () => new Array(n).fill(0));
			const t = new Triplets(n);
			const put = (i: number, j: number, v: number) => {
				dense[i][j] += v;
				t.add(i, j, v);
			};
			for (let i = 0; i < n; i++) put(i, i, 3 * r() - 1);
			// Rotations give complex pairs of large magnitude.
			for (let i = 0; i + 1 < 10; i += 2) {
				put(i, i + 1, 4 + i);
				put(i + 1, i, -(4 + i));
			}
			for (let e = 0; e < 2 * n; e++)
				put(Math.floor(r() * n), Math.floor(r() * n), 0.4 * (r() - 0.5));
			const a = cscFromTriplets(t);
			const res = largestMagnitudeEigenpairs(n, (x, y) => multiply(a, x, y), { k: 8, basis: 18 });
			expect(res.converged).toBe(true);
			const ref = (
				math.eigs(dense, { eigenvectors: false }).values as unknown as (number | math.Complex)[]
			)
				.map((v) => (typeof v === 'number' ? { re: v, im: 0 } : { re: v.re, im: v.im }))
				.sort((x, y) => Math.hypot(y.re, y.im) - Math.hypot(x.re, x.im));
			const scale = Math.hypot(ref[0].re, ref[0].im);
			for (let i = 0; i < res.re.length; i++) {
				const nearest = Math.min(...ref.map((v) => Math.hypot(v.re - res.re[i], v.im - res.im[i])));
				expect(nearest / scale).toBeLessThan(1e-9);
				// Each vector satisfies A·v = θ·v (complex): residual relative to |θ|.
				const ar = multiply(a, res.vr[i], new Float64Array(n));
				const ai = multiply(a, res.vi[i], new Float64Array(n));
				let worst = 0;
				for (let j = 0; j < n; j++) {
					const er = ar[j] - (res.re[i] * res.vr[i][j] - res.im[i] * res.vi[i][j]);
					const ei = ai[j] - (res.re[i] * res.vi[i][j] + res.im[i] * res.vr[i][j]);
					worst = Math.max(worst, Math.hypot(er, ei));
				}
				expect(worst / Math.hypot(res.re[i], res.im[i])).toBeLessThan(1e-9);
			}
			// Pairs are kept together: every complex value's conjugate is in the set.
			for (let i = 0; i < res.re.length; i++)
				if (res.im[i] !== 0)
					expect(
						Array.from(res.im).some((v, j) => j !== i && Math.abs(v + res.im[i]) < 1e-9 * scale)
					).toBe(true);
		});

		test('shift-invert on the fixed–free tridiagonal through the sparse LU: same 10 values', () => {
			const n = 500;
			const { a } = fixedFree(n);
			const f = sparseLu(a);
			const res = largestMagnitudeEigenpairs(n, (x, y) => (y.set(x), luSolveSparse(f, y)), {
				k: 10
			});
			expect(res.converged).toBe(true);
			for (let j = 1; j <= 10; j++) {
				expect(Math.abs(res.im[j - 1])).toBe(0);
				expect(Math.abs(1 / res.re[j - 1] - lambda(j, n)) / lambda(j, n)).toBeLessThan(1e-10);
			}
		});
	}
);
