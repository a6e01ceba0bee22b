import { describe, expect, test } from 'vitest';
import { analyze } from '../../../src/lib/solver/index';
import type { Analysis } from '../../../src/lib/solver/index';
import { el, net, type El } from './helpers';

/**
 * The sparse back end (src/lib/solver/large/) against outside sources and against the dense
 * back end. Sizes are modest here; the 20,000-section ladder, the 100,000-element mesh and 200
 * random networks of 200–1,000 elements run in `npm run bench` (scripts/bench-large.ts, scripts/check-backends.ts).
 */

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

function ladder(n: number, R = 1e3, C = 1e-9): El[] {
	const els: El[] = [el('Vin', 'V', ['x0', 'gnd'], 1)];
	for (let i = 1; i <= n; i++)
		els.push(el(`R${i}`, 'R', [`x${i - 1}`, `x${i}`], R), el(`C${i}`, 'C', [`x${i}`, 'gnd'], C));
	return els;
}

/**
 * Closed form: a uniform ladder driven by an ideal source (held at 0 for the natural
 * frequencies) with its far end open has nodal equations (1/R)·T·v + s·C·v = 0, T the n×n
 * tridiag(−1, 2, −1) whose last diagonal entry is 1 (the far node has one resistor). T's
 * eigenvalues are λ_j = 4·sin²((2j − 1)π / (2(2n + 1))) (Yueh, "Eigenvalues of several
 * tridiagonal matrices", Applied Mathematics E-Notes 5, 2005; also checked against mathjs in
 * kernels/krylov.test.ts), so the poles are s_j = −λ_j / (R·C).
 */
const lambda = (j: number, n: number) =>
	4 * Math.sin(((2 * j - 1) * Math.PI) / (2 * (2 * n + 1))) ** 2;

describe(
	'uniform RC ladder, 1,500 sections, sparse back end (closed forms)',
	{ timeout: 30_000 },
	() => {
		const n = 1500;
		const R = 1e3;
		const C = 1e-9;
		let a: Analysis;
		test('runs on the sparse back end and says how many poles exist', () => {
			a = analyze(net(ladder(n, R, C), `x${n}`), {
				backend: 'sparse',
				frequency: false,
				step: false
			});
			expect(a.meta.backend).toBe('sparse');
			expect(a.poleSet).toEqual({ method: 'lanczos', total: n, computed: 10, shift: 0 });
			expect(a.warnings.find((w) => w.code === 'dominant_poles_only')?.message).toMatch(
				/10 of 1500 poles/
			);
		});
		test('the 10 slowest poles equal −λ_j/(RC) to 1e-9, each with backward error ≤ 1e-10', () => {
			expect(a.poles).toHaveLength(10);
			a.poles.forEach((p, i) => {
				expect(rel(p.re, -lambda(i + 1, n) / (R * C))).toBeLessThan(1e-9);
				expect(p.im).toBe(0);
				expect(p.backwardError).toBeLessThanOrEqual(1e-10);
			});
		});
		test('open-circuit τ of the k-th capacitor is k·R·C (by inspection: k resistors to the source)', () => {
			expect(a.timeConstants.openCircuit).toHaveLength(n);
			a.timeConstants.openCircuit.forEach((t, i) =>
				expect(rel(t.tau!, (i + 1) * R * C)).toBeLessThan(1e-12)
			);
		});
		test('Elmore delay to the far end is R·C·n(n+1)/2 (Elmore 1948: Σ_k C·k·R)', () => {
			expect(a.timeConstants.elmore?.node).toBe(`x${n}`);
			expect(rel(a.timeConstants.elmore!.delay, (R * C * n * (n + 1)) / 2)).toBeLessThan(1e-12);
		});
		test('sequential estimate: C_n first with τ = n·R·C, then the middle of the ladder (n/2·R·C / 2)', () => {
			// Shorting the last capacitor leaves node n at ground for DC; capacitor k then sees
			// k·R ∥ (n − k)·R, largest at k = n/2: (n/2)·R/2 (by inspection).
			const s = a.timeConstants.sequential;
			expect(s).toHaveLength(10);
			expect(s[0].element).toBe(`C${n}`);
			expect(rel(s[0].tau!, n * R * C)).toBeLessThan(1e-12);
			expect(s[1].element).toBe(`C${n / 2}`);
			expect(rel(s[1].tau!, ((n / 2) * R * C) / 2)).toBeLessThan(1e-12);
		});
		test('DC gain 1, input impedance at DC open (no DC path to ground)', () => {
			expect(rel(a.dcGain!, 1)).toBeLessThan(1e-12);
			expect(a.inputImpedance?.dc).toBeNull();
		});
	}
);

describe(
	'lossless lumped LC line, 300 sections, general (Arnoldi) path — closed form',
	{ timeout: 30_000 },
	() => {
		// Series L, shunt C, driven by an ideal source, far end open: (1/(sL))·T·v + s·C·v = 0, so
		// s² = −λ_j/(LC): poles ±j·2·sin((2j − 1)π/(2(2n + 1)))/√(LC) (same T as above).
		const n = 300;
		const L = 1e-6;
		const C = 1e-9;
		const els: El[] = [el('Vin', 'V', ['y0', 'gnd'], 1)];
		for (let i = 1; i <= n; i++)
			els.push(el(`L${i}`, 'L', [`y${i - 1}`, `y${i}`], L), el(`C${i}`, 'C', [`y${i}`, 'gnd'], C));
		test('the 10 poles nearest the origin are the 5 lowest conjugate pairs to 1e-9', () => {
			const a = analyze(net(els, `y${n}`), { backend: 'sparse', frequency: false, step: false });
			expect(a.poleSet?.method).toBe('arnoldi');
			expect(a.poleSet?.total).toBe(2 * n);
			expect(a.poles).toHaveLength(10);
			for (let j = 1; j <= 5; j++) {
				const w = (2 * Math.sin(((2 * j - 1) * Math.PI) / (2 * (2 * n + 1)))) / Math.sqrt(L * C);
				const pair = a.poles.slice(2 * (j - 1), 2 * j);
				for (const p of pair) {
					expect(rel(Math.abs(p.im), w)).toBeLessThan(1e-9);
					expect(Math.abs(p.re)).toBeLessThan(1e-9 * w);
					expect(p.backwardError).toBeLessThanOrEqual(1e-10);
				}
				expect(pair[0].im).toBeCloseTo(-pair[1].im, 6);
			}
			// Zero-value time constants: capacitors see no resistance (inductors shorted): τ = 0.
			expect(
				a.timeConstants.openCircuit
					.filter((t) => t.element.startsWith('C'))
					.every((t) => t.tau === 0)
			).toBe(true);
		});
	}
);

describe(
	'Elmore delays on random RC trees against the tree formula (Elmore, J. Appl. Phys. 19, 1948)',
	{ timeout: 30_000 },
	() => {
		function rng(seed: number) {
			let s = seed >>> 0;
			return () => (s = (s * 1664525 + 1013904223) >>> 0) / 2 ** 32;
		}
		for (const seed of [1, 2, 3, 4]) {
			test(`tree ${seed}: 400 nodes, linear-time delay = Σ_i C_i·R(shared path) to 1e-12`, () => {
				const r = rng(seed);
				const size = 400;
				const parent = [0];
				const Rv = [0];
				const Cv = [0];
				const els: El[] = [el('Vin', 'V', ['t0', 'gnd'], 1)];
				for (let i = 1; i < size; i++) {
					parent.push(Math.floor(r() * i));
					Rv.push(10 ** (1 + 3 * r()));
					Cv.push(10 ** (-12 + 3 * r()));
					els.push(
						el(`R${i}`, 'R', [`t${parent[i]}`, `t${i}`], Rv[i]),
						el(`C${i}`, 'C', [`t${i}`, 'gnd'], Cv[i])
					);
				}
				const k = size - 1 - Math.floor(r() * 50);
				const onPath = new Set<number>();
				for (let j = k; j > 0; j = parent[j]) onPath.add(j);
				let expected = 0;
				for (let i = 1; i < size; i++) {
					let shared = 0;
					for (let j = i; j > 0; j = parent[j]) if (onPath.has(j)) shared += Rv[j];
					expected += Cv[i] * shared;
				}
				const a = analyze(net(els, `t${k}`), { backend: 'sparse', frequency: false, step: false });
				expect(rel(a.timeConstants.elmore!.delay, expected)).toBeLessThan(1e-12);
			});
		}
		test('not a tree (a resistor to ground): no Elmore delay is claimed', () => {
			const els = [...ladder(30), el('Rg', 'R', ['x10', 'gnd'], 1e4)];
			const a = analyze(net(els, 'x30'), { backend: 'sparse', frequency: false, step: false });
			expect(a.timeConstants.elmore).toBeNull();
		});
	}
);
