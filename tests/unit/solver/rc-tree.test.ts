import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import { analyze } from '../../../src/lib/solver/index';
import { el, expectRel, net, type El } from './helpers';

/** A random RC tree: node i > 0 hangs from parent[i] < i through R[i]; every node has C[i] to ground. */
function tree(parent: number[], R: number[], C: number[]) {
	const els: El[] = [el('Vin', 'V', ['t0', 'gnd'], 1)];
	for (let i = 1; i < parent.length; i++) {
		els.push(
			el(`R${i}`, 'R', [`t${parent[i]}`, `t${i}`], R[i]),
			el(`C${i}`, 'C', [`t${i}`, 'gnd'], C[i])
		);
	}
	return els;
}

/** Elmore's delay to node k: Σ_i C_i · (resistance shared by the paths root→i and root→k). */
function elmore(parent: number[], R: number[], C: number[], k: number): number {
	const path = (i: number) => {
		const s = new Set<number>();
		for (let j = i; j > 0; j = parent[j]) s.add(j);
		return s;
	};
	const pk = path(k);
	let t = 0;
	for (let i = 1; i < parent.length; i++) {
		let shared = 0;
		for (const j of path(i)) if (pk.has(j)) shared += R[j];
		t += C[i] * shared;
	}
	return t;
}

describe('Elmore delay on RC trees (Elmore, J. Appl. Phys. 19, 1948)', () => {
	test('the first moment b1 − a1 of the transfer to any node equals the Elmore delay (property, 1e-9)', () => {
		fc.assert(
			fc.property(
				fc.integer({ min: 2, max: 9 }).chain((n) =>
					fc.record({
						parent: fc.tuple(
							...Array.from({ length: n }, (_, i) =>
								fc.integer({ min: 0, max: Math.max(0, i - 1) })
							)
						),
						R: fc.array(fc.double({ min: 1, max: 5, noNaN: true }), { minLength: n, maxLength: n }),
						C: fc.array(fc.double({ min: -12, max: -8, noNaN: true }), {
							minLength: n,
							maxLength: n
						}),
						k: fc.integer({ min: 1, max: n - 1 })
					})
				),
				({ parent, R, C, k }) => {
					const Rv = R.map((x) => 10 ** x);
					const Cv = C.map((x) => 10 ** x);
					const a = analyze(net(tree(parent, Rv, Cv), `t${k}`), { frequency: false, step: false });
					const b1 = a.expansion!.denominator[0].value;
					const a1 = a.expansion!.numerator[1]?.value ?? 0;
					const a1terms = a.expansion!.numerator[1]?.termSum ?? 0;
					// The delay to a node near the root is a small difference of two large sums, so the
					// error is measured against b1 (1e-9·b1), not against the difference itself.
					const td = elmore(parent, Rv, Cv, k);
					expect(Math.abs(b1 - a1 - td), 'b1 − a1 from poles and zeros').toBeLessThanOrEqual(
						1e-9 * b1
					);
					expect(
						Math.abs(b1 - a1terms - td),
						'b1 − a1 from the transfer-constant terms'
					).toBeLessThanOrEqual(1e-9 * b1);
					expectRel(a.dcGain, 1, 1e-12, 'an RC tree passes DC');
				}
			),
			{ numRuns: 60, seed: 20260 }
		);
	});
});

describe('uniform RC ladder (closed form of the lumped and the distributed line)', () => {
	// N sections of R/N and C/N, open far end. The lumped ladder's modes are
	// 1/τ_k = (4N²/RC)·sin²((2k−1)π/(2(2N+1))); as N → ∞ the slowest tends to RC·4/π².
	const R = 1e4;
	const C = 1e-9;
	const ladder = (N: number) => {
		const els: El[] = [el('Vin', 'V', ['x0', 'gnd'], 1)];
		for (let i = 1; i <= N; i++)
			els.push(
				el(`R${i}`, 'R', [`x${i - 1}`, `x${i}`], R / N),
				el(`C${i}`, 'C', [`x${i}`, 'gnd'], C / N)
			);
		return net(els, `x${N}`);
	};
	test('all N = 40 modes match the lumped closed form (1e-9)', () => {
		const N = 40;
		const a = analyze(ladder(N), { frequency: false, step: false });
		expect(a.poles).toHaveLength(N);
		a.poles.forEach((p, i) => {
			const exact =
				((4 * N * N) / (R * C)) * Math.sin(((2 * i + 1) * Math.PI) / (2 * (2 * N + 1))) ** 2;
			expectRel(-p.re, exact, 1e-9, `mode ${i + 1}`);
		});
	});
	test('dominant τ → 4RC/π² as the ladder is refined: τ1 = (4RC/π²)(1 + 1/2N)² + O(1/N²)', () => {
		// Expanding the lumped formula for large N gives the first-order approach to the line's
		// limit; with N = 100 the solver must sit within 1.1/N of 4RC/π² and approach it.
		const N = 100;
		const a = analyze(ladder(N), { frequency: false, step: false });
		const limit = (4 * R * C) / Math.PI ** 2;
		expectRel(
			a.poles[0].tau,
			limit * (1 + 1 / (2 * N)) ** 2,
			1e-4,
			'dominant τ against the expansion'
		);
		expect(Math.abs(a.poles[0].tau! / limit - 1)).toBeLessThan(1.1 / N);
		const coarse = analyze(ladder(10), { frequency: false, step: false });
		expect(Math.abs(coarse.poles[0].tau! / limit - 1)).toBeGreaterThan(
			Math.abs(a.poles[0].tau! / limit - 1)
		);
		// and the open-circuit sum Σ τ = RC(N+1)/(2N) → RC/2 (published identity b1 = Σ τ_oc)
		expectRel(a.expansion!.denominator[0].value, (R * C * (N + 1)) / (2 * N), 1e-9, 'b1');
	});
});
