// The quick estimates of each pole, best first, against closed forms and published results.
import { describe, expect, test } from 'vitest';
import { analyze } from '../../../src/lib/solver/index';
import { digitizerDivider } from '../../../src/lib/server/db/seed/demo-sheets';
import { el, expectRel, net } from './helpers';

/** N equal sections R–C driven by a voltage source, read at the open far end. */
function ladder(n: number, r = 1e3, c = 1e-9) {
	const els = [el('Vin', 'V', ['n0', 'gnd'], 1)];
	for (let k = 1; k <= n; k++) {
		els.push(el(`R${k}`, 'R', [`n${k - 1}`, `n${k}`], r));
		els.push(el(`C${k}`, 'C', [`n${k}`, 'gnd'], c));
	}
	return net(els, `n${n}`);
}

describe('3-section RC ladder (closed forms)', () => {
	const RC = 1e-6;
	const a = analyze(ladder(3));
	// The node matrix of the uniform ladder open at its end has eigenvalues 2 − 2cos((2k−1)π/7),
	// k = 1..3, in units of 1/RC (tridiagonal closed form; common practice).
	const lambda = [1, 2, 3].map((k) => 2 - 2 * Math.cos(((2 * k - 1) * Math.PI) / 7));
	test('exact poles −λk/RC with λk = 2 − 2cos((2k−1)π/7) (closed form, 1e-10)', () => {
		a.poles.forEach((p, i) => expectRel(p.re, -lambda[i] / RC, 1e-10, `pole ${i + 1}`));
	});
	test('b1 = RC + 2RC + 3RC = 6RC (Ck sees k·R with the others open; closed form, 1e-12)', () => {
		const b1 = a.timeConstants.openCircuit.reduce((s, t) => s + t.tau!, 0);
		expectRel(b1, 6 * RC, 1e-12, 'b1');
		const oneOverB1 = a.poles[0].estimates.find((e) => e.method === 'b1')!;
		expectRel(oneOverB1.re, -1 / (6 * RC), 1e-12, '−1/b1');
		// 1/6 against λ1 = 0.198: 16 % off — why −1/b1 alone is not the headline here.
		expect(oneOverB1.relativeError).toBeGreaterThan(0.15);
	});
	test('headline for the dominant pole: the two-pole root of 1 + 6x + 5x² (x = s·RC), −0.2/RC, within 5 % and named', () => {
		// b2 = Σ pairs 1/(λiλj) = λ1+λ2+λ3 over λ1λ2λ3 = 5/1 (trace 6, determinant 1 of the matrix).
		const p = a.poles[0];
		expect(p.estimate!.method).toBe('two-pole');
		expect(p.estimate!.basis).toBe('1 + b1·s + b2·s²');
		expectRel(p.estimate!.re, -0.2 / RC, 1e-9, 'two-pole root');
		expect(p.relativeError!).toBeLessThan(0.05);
		expectRel(p.relativeError, Math.abs(0.2 - lambda[0]) / lambda[0], 1e-8, 'error');
	});
	test('every pole lists each estimate it has, headline first, the rest by error; real poles carry no Q', () => {
		for (const p of a.poles) {
			expect(p.q).toBeNull();
			expect(p.zeta).toBeNull();
			const rest = p.estimates.slice(1).map((e) => e.relativeError);
			expect(rest).toEqual(rest.slice().sort((x, y) => x - y));
			expect(p.estimates[0]).toEqual(p.estimate);
		}
		expect(a.poles[0].estimates.map((e) => e.method).sort()).toEqual([
			'b1',
			'sequential',
			'two-pole'
		]);
		expect(a.poles[2].estimates.map((e) => e.method).sort()).toEqual(['ratio', 'sequential']);
		// The ratio of the third pole is b2/b3 = 5/1 (closed form above).
		const r = a.poles[2].estimates.find((e) => e.method === 'ratio')!;
		expect(r.basis).toBe('b2/b3');
		expectRel(r.re, -5 / RC, 1e-9, 'b2/b3');
	});
});

describe('long uniform RC ladder against the distributed line (Elmore, J. Appl. Phys. 19, 1948; common practice)', () => {
	// A uniform RC line of total R and C, open at the far end, has its slowest time constant
	// 4RC/π² (first mode of the diffusion equation); its Elmore delay — b1 — is RC/2. Their ratio
	// π²/8 is how far −1/b1 misses the dominant pole of a long line (common practice).
	const N = 200;
	const R = 1e3;
	const C = 1e-9;
	const a = analyze(ladder(N, R / N, C / N), { frequency: false, step: false, expansion: false });
	const RC = R * C;
	test('the exact dominant pole tends to π²/(4RC) (0.5 % at 200 sections)', () => {
		expectRel(a.poles[0].re, -(Math.PI ** 2) / (4 * RC), 5e-3, 'dominant pole');
	});
	test('b1 = RC·(N+1)/(2N) → RC/2, the Elmore delay (closed form, 1e-10)', () => {
		const b1 = a.timeConstants.openCircuit.reduce((s, t) => s + t.tau!, 0);
		expectRel(b1, (RC * (N + 1)) / (2 * N), 1e-10, 'b1');
	});
	test('−1/b1 misses the dominant pole by 1 − 8/π² ≈ 19 % (to 1 %); the headline estimate is within 5 %', () => {
		const e = a.poles[0].estimates.find((x) => x.method === 'b1')!;
		expectRel(e.relativeError, 1 - 8 / Math.PI ** 2, 1e-2, 'b1 error');
		expect(a.poles[0].relativeError!).toBeLessThan(0.05);
		// For the continuous line the two-pole root is −6 + √12 in units of 1/RC (b1 = 1/2,
		// b2 = 1/24 from Σ 1/λk and Σ 1/λk² with λk = (2k−1)²π²/4): 2.8 % from π²/4.
		const two = a.poles[0].estimates.find((x) => x.method === 'two-pole')!;
		expectRel(two.re, (-6 + Math.sqrt(12)) / RC, 1e-2, 'two-pole of the line');
	});
});

describe('the demo divider (Kestrel Ridge demo sheet)', () => {
	const a = analyze(digitizerDivider);
	test('Ccable and Cadc form one 60 pF port; the dominant pole is headed by −1/b1, within 5 % (in fact 5e-6)', () => {
		const port = a.timeConstants.openCircuit.find((t) => t.members.length === 2)!;
		expect(port.element).toBe('Ccable + Cadc');
		expectRel(port.value, 60e-12, 1e-12, 'total');
		expect(a.poles[0].estimate!.method).toBe('b1');
		expect(a.poles[0].relativeError!).toBeLessThan(0.05);
	});
});

describe('complex pairs: the two-pole estimate is a pair, and only pairs carry ω0, Q and ζ', () => {
	// Series RLC driven by a voltage, read across C: 1 + RC·s + LC·s² is the whole denominator, so
	// the two-pole estimate is exact (closed form).
	const a = analyze(
		net(
			[
				el('Vin', 'V', ['in', 'gnd'], 1),
				el('R', 'R', ['in', 'a'], '10'),
				el('L', 'L', ['a', 'b'], '1u'),
				el('C', 'C', ['b', 'gnd'], '1n')
			],
			'b'
		)
	);
	test('ω0 = 1/√(LC), Q = √(L/C)/R; the headline two-pole estimate is the pair itself (1e-9)', () => {
		const p = a.poles[0];
		expectRel(p.omega0, 1 / Math.sqrt(1e-15), 1e-9, 'ω0');
		expectRel(p.q, Math.sqrt(1e-6 / 1e-9) / 10, 1e-9, 'Q');
		expect(p.estimate!.method).toBe('two-pole');
		expect(Math.sign(p.estimate!.im)).toBe(Math.sign(p.im));
		expect(p.relativeError!).toBeLessThan(1e-9);
	});
});
