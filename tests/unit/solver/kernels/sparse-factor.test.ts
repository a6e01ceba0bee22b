import { describe, expect, test } from 'vitest';
import * as math from 'mathjs';
import { Triplets, cscFromTriplets, multiply, entry } from '../../../../src/lib/solver/kernels/csc';
import { ldl, ldlSolve, ldlSymbolic } from '../../../../src/lib/solver/kernels/ldl';
import { minimumDegreeOrder } from '../../../../src/lib/solver/kernels/minimum-degree';
import { symmetricPattern } from '../../../../src/lib/solver/kernels/csc';
import {
	inverseDiagonal,
	inverseEntry,
	selectedInverse
} from '../../../../src/lib/solver/kernels/selected-inverse';
import {
	luSolveSparse,
	luSolveSparseComplex,
	luSolveSparseTransposed,
	sparseLu
} from '../../../../src/lib/solver/kernels/sparse-lu';

function rng(seed: number) {
	let s = seed >>> 0;
	return () => (s = (s * 1664525 + 1013904223) >>> 0) / 2 ** 32;
}

/** A random conductance matrix (a resistor network with some paths to the reference): the
 *  kind of matrix the kernels serve. Returns the sparse form, a dense copy and the row sums. */
function conductance(n: number, seed: number) {
	const r = rng(seed);
	const t = new Triplets(n);
	const dense: number[][] = Array.from({ length: n }, () => new Array(n).fill(0));
	const excess = new Float64Array(n);
	const stamp = (a: number, b: number, g: number) => {
		t.add(a, a, g);
		t.add(b, b, g);
		t.add(a, b, -g);
		t.add(b, a, -g);
		dense[a][a] += g;
		dense[b][b] += g;
		dense[a][b] -= g;
		dense[b][a] -= g;
	};
	for (let i = 1; i < n; i++) stamp(i, Math.floor(r() * i), 10 ** (4 * r() - 2));
	for (let e = 0; e < n; e++) {
		const a = Math.floor(r() * n);
		const b = Math.floor(r() * n);
		if (a !== b) stamp(a, b, 10 ** (4 * r() - 2));
	}
	for (let i = 0; i < n; i += 1 + Math.floor(r() * 7)) {
		const g = 10 ** (2 * r() - 3);
		t.add(i, i, g);
		dense[i][i] += g;
		excess[i] += g;
	}
	return { a: cscFromTriplets(t), dense, excess };
}

const relDiff = (x: number, y: number, scale: number) => Math.abs(x - y) / scale;

describe('compressed sparse columns', () => {
	test('duplicates are summed, exact cancellations dropped, rows sorted', () => {
		const t = new Triplets(3);
		t.add(2, 0, 1);
		t.add(0, 0, 2);
		t.add(2, 0, 3);
		t.add(1, 1, 5);
		t.add(1, 1, -5);
		const a = cscFromTriplets(t);
		expect(Array.from(a.colPtr)).toEqual([0, 2, 2, 2]);
		expect(Array.from(a.rowIdx)).toEqual([0, 2]);
		expect(Array.from(a.values)).toEqual([2, 4]);
		expect(entry(a, 2, 0)).toBe(4);
		expect(entry(a, 1, 1)).toBe(0);
		expect(Array.from(multiply(a, Float64Array.of(1, 1, 1), new Float64Array(3)))).toEqual([
			2, 0, 4
		]);
	});

	test('an empty matrix factors and solves to nothing', () => {
		const a = cscFromTriplets(new Triplets(0));
		expect(ldl(a).d.length).toBe(0);
		expect(sparseLu(a).singular).toBe(false);
	});
});

describe('minimum-degree ordering', () => {
	test('a star (one hub joined to every leaf) eliminates the hub at the end: no fill at all', () => {
		// Common practice / textbook example of why ordering matters: hub first fills the whole matrix.
		const n = 50;
		const t = new Triplets(n);
		for (let i = 1; i < n; i++) {
			t.add(0, i, -1);
			t.add(i, 0, -1);
			t.add(i, i, 2);
		}
		t.add(0, 0, n);
		const a = cscFromTriplets(t);
		const { ptr, adj } = symmetricPattern(a);
		const q = minimumDegreeOrder(n, ptr, adj);
		// The hub goes in the last two places (with one leaf left, hub and leaf tie at degree 1).
		expect(Array.from(q.subarray(n - 2))).toContain(0);
		expect(new Set(q).size).toBe(n);
		expect(ldl(a).lx.length).toBe(n - 1);
	});

	test('a 30×30 grid fills far less than in natural order (a valid permutation)', () => {
		const side = 30;
		const n = side * side;
		const t = new Triplets(n);
		for (let i = 0; i < n; i++) {
			t.add(i, i, 4.1);
			for (const j of [i % side < side - 1 ? i + 1 : -1, i + side < n ? i + side : -1]) {
				if (j < 0) continue;
				t.add(i, j, -1);
				t.add(j, i, -1);
			}
		}
		const a = cscFromTriplets(t);
		const natural = ldlSymbolic(
			a,
			Int32Array.from({ length: n }, (_, i) => i)
		);
		const md = ldlSymbolic(a);
		expect(new Set(md.order).size).toBe(n);
		// Natural order fills the band: about n·side entries; minimum degree about half of it or less.
		expect(md.rowIdx.length).toBeLessThan(0.6 * natural.rowIdx.length);
	});
});

describe(
	'sparse LDLᵀ and selected inversion against mathjs (an independent dense inverse)',
	{ timeout: 30_000 },
	() => {
		for (const [n, seed] of [
			[8, 1],
			[40, 2],
			[120, 3]
		] as const) {
			test(`random conductance matrix n = ${n}: solve, diagonal and pattern of A⁻¹ to 1e-9`, () => {
				const { a, dense, excess } = conductance(n, seed);
				const inv = math.inv(dense) as number[][];
				for (const ex of [undefined, excess]) {
					const f = ldl(a, ex);
					expect(f.accurate).toBe(!!ex);
					const b = Float64Array.from({ length: n }, (_, i) => Math.sin(i + 1));
					const x = ldlSolve(f, b.slice());
					const ref = math.multiply(inv, Array.from(b)) as number[];
					const xs = Math.max(...ref.map(Math.abs));
					for (let i = 0; i < n; i++) expect(relDiff(x[i], ref[i], xs)).toBeLessThan(1e-9);
					const z = selectedInverse(f);
					const d = inverseDiagonal(f, z);
					for (let i = 0; i < n; i++)
						expect(relDiff(d[i], inv[i][i], inv[i][i])).toBeLessThan(1e-9);
					let checked = 0;
					for (let i = 0; i < n; i++)
						for (let j = 0; j < n; j++) {
							const v = inverseEntry(f, z, i, j);
							if (Number.isNaN(v)) continue;
							checked++;
							expect(relDiff(v, inv[i][j], Math.sqrt(inv[i][i] * inv[j][j]))).toBeLessThan(1e-9);
						}
					// Every stored entry of the matrix itself lies on the factor's pattern.
					expect(checked).toBeGreaterThanOrEqual(a.values.length);
				}
			});
		}

		test('accurate mode is refused for a positive off-diagonal (not an M-matrix)', () => {
			const t = new Triplets(2);
			t.add(0, 0, 2);
			t.add(1, 1, 2);
			t.add(0, 1, 1);
			t.add(1, 0, 1);
			const f = ldl(cscFromTriplets(t), Float64Array.of(3, 3));
			expect(f.accurate).toBe(false);
			expect(f.d[0] * f.d[1]).toBeCloseTo(3, 12);
		});
	}
);

// mathjs's dense complex lusolve is the slow side here; on a loaded 2-core machine it can pass
// the default 5 s, so these allow 30 s.
describe('sparse LU (real and complex) against mathjs lusolve', { timeout: 30_000 }, () => {
	/** Modified-nodal-like: some zero diagonals, nonsymmetric couplings. */
	function mna(n: number, seed: number) {
		const r = rng(seed);
		const t = new Triplets(n);
		const dense: number[][] = Array.from({ length: n }, () => new Array(n).fill(0));
		const put = (i: number, j: number, v: number) => {
			t.add(i, j, v);
			dense[i][j] += v;
		};
		for (let i = 0; i < n; i++) if (r() < 0.8) put(i, i, 1 + 3 * r());
		for (let e = 0; e < 3 * n; e++) put(Math.floor(r() * n), Math.floor(r() * n), r() - 0.5);
		for (let i = 0; i < n; i++) put(i, (i + 1) % n, 0.3);
		return { a: cscFromTriplets(t), dense };
	}
	for (const [n, seed] of [
		[5, 4],
		[60, 5],
		[120, 6]
	] as const) {
		test(`n = ${n}: A·x = b, Aᵀ·x = b and a complex matrix to 1e-9`, () => {
			const { a, dense } = mna(n, seed);
			const b = Array.from({ length: n }, (_, i) => Math.cos(3 * i));
			const f = sparseLu(a);
			expect(f.singular).toBe(false);
			const ref = (math.lusolve(dense, b) as number[][]).map((r) => r[0]);
			const scale = Math.max(...ref.map(Math.abs));
			const x = luSolveSparse(f, Float64Array.from(b));
			for (let i = 0; i < n; i++) expect(relDiff(x[i], ref[i], scale)).toBeLessThan(1e-9);
			const refT = (math.lusolve(math.transpose(dense), b) as number[][]).map((r) => r[0]);
			const scaleT = Math.max(...refT.map(Math.abs));
			const xt = luSolveSparseTransposed(f, Float64Array.from(b));
			for (let i = 0; i < n; i++) expect(relDiff(xt[i], refT[i], scaleT)).toBeLessThan(1e-9);
			// Complex: A + j·diag-pattern values (every stored entry gets an imaginary part).
			const im = Float64Array.from(a.values, (v, p) => 0.5 * Math.sin(p) * v);
			const cdense = dense.map((row) => row.map((v) => math.complex(v, 0)));
			for (let j = 0; j < n; j++)
				for (let p = a.colPtr[j]; p < a.colPtr[j + 1]; p++)
					cdense[a.rowIdx[p]][j] = math.complex(a.values[p], im[p]);
			const cref = (math.lusolve(cdense, b) as math.Complex[][]).map((r) => r[0]);
			const cs = Math.max(...cref.map((c) => math.abs(c) as unknown as number));
			const fc = sparseLu(a, im, f.q);
			const br = Float64Array.from(b);
			const bi = new Float64Array(n);
			luSolveSparseComplex(fc, br, bi);
			for (let i = 0; i < n; i++)
				expect(Math.hypot(br[i] - cref[i].re, bi[i] - cref[i].im) / cs).toBeLessThan(1e-9);
		});
	}

	test('a structurally singular matrix is reported, not divided by zero', () => {
		const t = new Triplets(3);
		t.add(0, 0, 1);
		t.add(1, 0, 1);
		t.add(2, 2, 1);
		const f = sparseLu(cscFromTriplets(t));
		expect(f.singular).toBe(true);
		expect(f.pivotRatio).toBe(0);
	});
});
