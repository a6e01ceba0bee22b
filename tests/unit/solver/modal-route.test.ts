// The modal reduction of the wide-band route (modal-route.ts) against the identities that define
// it — for the symmetric definite pencil (C, A0) with A0 = G + s0·C positive definite, the
// eigenvector matrix X satisfies Xᵀ·A0·X = I and Xᵀ·C·X = Λ (Golub and Van Loan, "Matrix
// Computations", 4th ed., §8.7) — and its answers against mathjs's complex LU solve of the same
// equations, on networks it must take and on networks it must refuse.
import { describe, expect, test } from 'vitest';
import * as math from 'mathjs';
import { validateNetwork } from '../../../src/lib/solver/index';
import { assemble } from '../../../src/lib/solver/assemble';
import { directSystem } from '../../../src/lib/solver/direct-solve';
import { modalRoute, solveByModal } from '../../../src/lib/solver/modal-route';
import { complexVector } from '../../../src/lib/solver/kernels/real-complex-product';
import { randomNetwork, type NetworkClass } from './random-networks';

function system(doc: unknown, s0: number) {
	const sys = directSystem(
		assemble(validateNetwork(doc), () => 'pencil'),
		s0
	);
	return { sys, eq: { n: sys.n, g: sys.g, cap: sys.cap, b: sys.b } };
}

function dense(t: { r: Int32Array; c: Int32Array; v: Float64Array }, n: number) {
	const a = new Float64Array(n * n);
	for (let k = 0; k < t.v.length; k++) a[t.r[k] * n + t.c[k]] += t.v[k];
	return a;
}

const S0 = 2 * Math.PI * 1e5;

describe('modal reduction: the defining identities (Golub and Van Loan §8.7)', () => {
	test.each([
		['rc', 40, 11],
		['rc', 70, 12],
		['rc-floating', 60, 13]
	] as [NetworkClass, number, number][])(
		'%s network of %i elements (seed %i): Xᵀ·A0·X = I and Xᵀ·C·X = Λ to 1e-10',
		(kind, size, seed) => {
			const { eq } = system(randomNetwork(kind, size, seed), S0);
			const route = modalRoute(eq, S0);
			expect(route).not.toBeNull();
			const { free, x, lambda } = route!;
			const nf = free.length;
			const G = dense(eq.g, eq.n);
			const C = dense(eq.cap, eq.n);
			const at = (m: Float64Array, i: number, j: number) => m[free[i] * eq.n + free[j]];
			let worstA = 0;
			let worstC = 0;
			const top = Math.max(...lambda.map(Math.abs));
			for (let p = 0; p < nf; p++)
				for (let q = 0; q < nf; q++) {
					let sa = 0;
					let sc = 0;
					for (let i = 0; i < nf; i++)
						for (let j = 0; j < nf; j++) {
							const xx = x[i * nf + p] * x[j * nf + q];
							sa += xx * (at(G, i, j) + S0 * at(C, i, j));
							sc += xx * at(C, i, j);
						}
					worstA = Math.max(worstA, Math.abs(sa - (p === q ? 1 : 0)));
					worstC = Math.max(worstC, Math.abs(sc - (p === q ? lambda[p] : 0)) / top);
				}
			expect(worstA).toBeLessThan(1e-10);
			expect(worstC).toBeLessThan(1e-10);
		}
	);
});

describe('modal reduction: answers against mathjs lusolve (1e-10) and refusals', () => {
	// (Not the ten-decade ladder: mathjs's lusolve returns an exact 0 for its output at 10 kHz,
	// where the banded LU and this route agree to 1e-15; hessenberg-route.test.ts compares the
	// route with the LU on it.)
	test('random RC networks: H at jω over eight decades', () => {
		const docs = [
			randomNetwork('rc', 50, 21),
			randomNetwork('rc-floating', 45, 22),
			randomNetwork('rc', 90, 23)
		];
		let compared = 0;
		const problems: string[] = [];
		for (const doc of docs) {
			const { sys, eq } = system(doc, S0);
			const route = modalRoute(eq, S0);
			expect(route).not.toBeNull();
			const n = eq.n;
			const G = dense(eq.g, n);
			const C = dense(eq.cap, n);
			const b = new Float64Array(n);
			for (let k = 0; k < eq.b.idx.length; k++) b[eq.b.idx[k]] += eq.b.val[k];
			for (let k = 0; k <= 8; k++) {
				const w = 2 * Math.PI * 10 ** (1 + k);
				const A = Array.from({ length: n }, (_, i) =>
					Array.from({ length: n }, (_, j) => math.complex(G[i * n + j], w * C[i * n + j]))
				);
				const want = (
					math.lusolve(
						A,
						Array.from(b, (v) => [v])
					) as unknown as math.Complex[][]
				).map((r) => math.complex(r[0])); // an exact zero comes back as the number 0
				const got = complexVector(n);
				if (!solveByModal(eq, route!, 0, w, got, null)) continue;
				const scale = Math.max(...want.map((z) => Math.hypot(z.re, z.im)));
				// The output node's voltage, relative to itself where it is not negligible.
				const out = sys.out.idx[0];
				const ref = want[out];
				const err = Math.hypot(got.re[out] - ref.re, got.im[out] - ref.im);
				const bound = 1e-10 * Math.max(Math.hypot(ref.re, ref.im), 1e-12 * scale);
				if (!(err < bound)) problems.push(`${k}: ${err} vs ${bound} (${JSON.stringify(ref)})`);
				compared++;
			}
		}
		expect(problems, problems.join('\n')).toEqual([]);
		expect(compared).toBeGreaterThan(20);
	});
	test('refused where the equations are not symmetric definite: controlled sources, inductors', () => {
		for (const [kind, seed] of [
			['active', 31],
			['rlc', 32]
		] as [NetworkClass, number][]) {
			const { eq } = system(randomNetwork(kind, 50, seed), S0);
			expect(modalRoute(eq, S0), `${kind} #${seed}`).toBeNull();
		}
	});
});
