import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import { eigs } from 'mathjs';
import { analyze, frequencyResponseAt } from '../../../src/lib/solver/index';
import { el, net, rel, type El } from './helpers';

/**
 * Random RC networks: a spanning tree of resistors from every node towards ground keeps a DC
 * path everywhere; extra resistors and capacitors land on random node pairs (ground included),
 * so capacitor loops and floating-at-DC corners both occur. Values log-uniform over 3 decades.
 */
const rcNetwork = fc.integer({ min: 2, max: 7 }).chain((n) =>
	fc.record({
		n: fc.constant(n),
		tree: fc.array(
			fc.tuple(fc.integer({ min: -1, max: n - 1 }), fc.double({ min: 0, max: 3, noNaN: true })),
			{ minLength: n, maxLength: n }
		),
		extraR: fc.array(
			fc.tuple(
				fc.integer({ min: -1, max: n - 1 }),
				fc.integer({ min: -1, max: n - 1 }),
				fc.double({ min: 0, max: 3, noNaN: true })
			),
			{ maxLength: 4 }
		),
		caps: fc.array(
			fc.tuple(
				fc.integer({ min: -1, max: n - 1 }),
				fc.integer({ min: -1, max: n - 1 }),
				fc.double({ min: 0, max: 3, noNaN: true })
			),
			{ minLength: 1, maxLength: 6 }
		),
		out: fc.integer({ min: 0, max: n - 1 })
	})
);

function build(r: {
	n: number;
	tree: [number, number][];
	extraR: [number, number, number][];
	caps: [number, number, number][];
	out: number;
}) {
	const name = (i: number) => (i < 0 ? 'gnd' : `n${i}`);
	const els: El[] = [el('Vin', 'V', ['src', 'gnd'], 1), el('Rs', 'R', ['src', 'n0'], 100)];
	r.tree.forEach(([to, v], i) => {
		const parent = i === 0 ? -1 : Math.min(to, i - 1); // towards lower indices or ground: a tree
		els.push(el(`Rt${i}`, 'R', [name(i), name(parent)], 1e3 * 10 ** v));
	});
	r.extraR.forEach(([a, b, v], i) => {
		if (a !== b) els.push(el(`Rx${i}`, 'R', [name(a), name(b)], 1e3 * 10 ** v));
	});
	let nc = 0;
	r.caps.forEach(([a, b, v], i) => {
		if (a !== b) {
			els.push(el(`C${i}`, 'C', [name(a), name(b)], 1e-9 * 10 ** v));
			nc++;
		}
	});
	if (nc === 0) els.push(el('Cz', 'C', [name(r.out), 'gnd'], 1e-9));
	return net(els, name(r.out));
}

const RUNS = { numRuns: 80, seed: 4242 };

describe('identities on random RC networks (property tests)', () => {
	test('Σ open-circuit τ = −Σ 1/p (published identity: b1 of the denominator; 1e-9)', () => {
		fc.assert(
			fc.property(rcNetwork, (r) => {
				const a = analyze(build(r), { frequency: false, step: false });
				const sumTau = a.timeConstants.openCircuit.reduce((s, t) => s + (t.tau as number), 0);
				const sumInv = -a.poles.reduce((s, p) => s + p.re / (p.re * p.re + p.im * p.im), 0);
				expect(rel(sumInv, sumTau)).toBeLessThan(1e-9);
			}),
			RUNS
		);
	});
	test('Σ 1/τ_sc = −Σ p when every short-circuit τ is finite and non-zero (published identity; 1e-9)', () => {
		let checked = 0;
		fc.assert(
			fc.property(rcNetwork, (r) => {
				const a = analyze(build(r), { frequency: false, step: false });
				const sc = a.timeConstants.shortCircuit;
				if (sc.some((t) => t.tau === null || t.tau === 0)) return;
				checked++;
				const sumInv = sc.reduce((s, t) => s + 1 / (t.tau as number), 0);
				expect(rel(-a.poles.reduce((s, p) => s + p.re, 0), sumInv)).toBeLessThan(1e-9);
			}),
			RUNS
		);
		expect(checked).toBeGreaterThan(20);
	});
	test('the pole–zero form K·Π(s−z)/Π(s−p) reproduces a direct complex solve (1e-8)', () => {
		fc.assert(
			fc.property(rcNetwork, (r) => {
				const doc = build(r);
				const a = analyze(doc, { frequency: false, step: false });
				if (a.dcGain === null || a.dcGain === 0 || a.zeros.some((z) => z.hz === 0)) return;
				const scale = Math.max(...a.poles.map((p) => p.hz), 1);
				const fs = [1e-3, 0.1, 1, 10].map((x) => x * scale);
				const direct = frequencyResponseAt(doc, fs);
				fs.forEach((f, i) => {
					// H(s) = H(0) Π(1 − s/z) / Π(1 − s/p)
					let hr = a.dcGain as number;
					let hi = 0;
					const mul = (ar: number, ai: number) => {
						[hr, hi] = [hr * ar - hi * ai, hr * ai + hi * ar];
					};
					const s = 2 * Math.PI * f;
					for (const z of a.zeros) {
						const d = z.re * z.re + z.im * z.im;
						mul(1 - (s * z.im) / d, -(s * z.re) / d); // 1 − jω/z = 1 − jω·z̄/|z|²
					}
					for (const p of a.poles) {
						const d = p.re * p.re + p.im * p.im;
						const ar = 1 - (s * p.im) / d;
						const ai = -(s * p.re) / d;
						const m2 = ar * ar + ai * ai;
						mul(ar / m2, -ai / m2);
					}
					const h = direct.h[i];
					const mag = Math.hypot(h.re, h.im);
					expect(
						Math.hypot(hr - h.re, hi - h.im) / Math.max(mag, 1e-12 * Math.abs(a.dcGain as number))
					).toBeLessThan(1e-8);
				});
			}),
			{ numRuns: 60, seed: 777 }
		);
	});
	test('second opinion from mathjs eigs: eigenvalues of the time-constant matrix R·C are −1/p (1e-9 of the largest)', () => {
		fc.assert(
			fc.property(rcNetwork, (r) => {
				const a = analyze(build(r), { frequency: false, step: false });
				const { R, C } = a.portMatrices;
				if (R.some((row) => row.some((x) => x === null))) return;
				// C^½ R C^½ is symmetric with the eigenvalues of R·C, so mathjs's symmetric path applies.
				const c = C.map((row, i) => Math.sqrt(row[i]));
				const S = R.map((row, i) =>
					row.map((x, j) => (c[i] * (x as number) * c[j] + c[j] * (R[j][i] as number) * c[i]) / 2)
				);
				const values = (eigs(S).values as unknown as number[])
					.map(Number)
					.filter((v) => Math.abs(v) > 1e-14 * Math.max(...S.map((row, i) => Math.abs(row[i]))));
				const mine = a.poles.map((p) => -1 / p.re);
				values.sort((x, y) => y - x);
				mine.sort((x, y) => y - x);
				expect(mine.length).toBe(values.length);
				const top = values[0];
				mine.forEach((v, i) => expect(Math.abs(v - values[i])).toBeLessThan(1e-9 * top));
			}),
			{ numRuns: 60, seed: 99 }
		);
	});
});
