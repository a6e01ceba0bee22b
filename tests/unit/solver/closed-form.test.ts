import { describe, expect, test } from 'vitest';
import { analyze } from '../../../src/lib/solver/index';
import { el, expectRel, net, probe10x, quadratic, worstRootError } from './helpers';

const TWO_PI = 2 * Math.PI;

describe('RC low-pass', () => {
	// Source: closed form, corner frequency 1/(2πRC), single real pole at −1/RC, DC gain 1.
	const R = 4.7e3;
	const C = 2.2e-9;
	const a = analyze(
		net(
			[
				el('Vin', 'V', ['in', 'gnd'], 1),
				el('R1', 'R', ['in', 'out'], '4.7k'),
				el('C1', 'C', ['out', 'gnd'], '2.2n')
			],
			'out'
		)
	);
	test('pole, corner, DC gain, time constant (tolerance 1e-10)', () => {
		expect(a.poles).toHaveLength(1);
		expectRel(a.poles[0].re, -1 / (R * C), 1e-10, 'pole');
		expectRel(a.poles[0].hz, 1 / (TWO_PI * R * C), 1e-10, 'corner Hz');
		expectRel(a.dcGain, 1, 1e-12, 'DC gain');
		expectRel(a.timeConstants.openCircuit[0].tau, R * C, 1e-12, 'open-circuit τ');
		expect(a.zeros).toHaveLength(0);
	});
	test('−3 dB bandwidth equals the corner; 10–90 % rise time is RC·ln 9 (closed form, 1e-8)', () => {
		expectRel(a.bandwidth, 1 / (TWO_PI * R * C), 1e-8, 'bandwidth');
		expectRel(a.step!.riseTime, R * C * Math.log(9), 1e-8, 'rise time');
		expectRel(a.step!.settlingTime, R * C * Math.log(100), 1e-8, '1 % settling');
		expect(a.step!.overshoot).toBeLessThan(1e-9);
	});
	test('magnitude and phase at the corner are −3.0103 dB and −45° (closed form, 1e-9)', () => {
		const b = analyze(
			net(
				[
					el('Vin', 'V', ['in', 'gnd'], 1),
					el('R1', 'R', ['in', 'out'], R),
					el('C1', 'C', ['out', 'gnd'], C)
				],
				'out'
			),
			{
				frequency: { fMin: 1 / (TWO_PI * R * C), fMax: 10 / (TWO_PI * R * C), points: 2 }
			}
		);
		expectRel(b.frequencyResponse!.magnitudeDb[0], -10 * Math.log10(2), 1e-9, 'dB at corner');
		expectRel(b.frequencyResponse!.phaseDeg[0], -45, 1e-9, 'phase at corner');
		expectRel(b.frequencyResponse!.groupDelay[0], (R * C) / 2, 1e-9, 'group delay RC/(1+1)');
	});
});

describe('10:1 passive probe on a scope input (common practice, no citation)', () => {
	// 9 MΩ ∥ 10 pF over 1 MΩ ∥ 90 pF, driven from 50 Ω, output across the 1 MΩ.
	const [Rs, Rt, Ct, Rin, Cin] = [50, 9e6, 10e-12, 1e6, 90e-12];
	const a = analyze(probe10x());
	// Closed form: the two-node determinant (ga+gt+sCt)(gt+gi+s(Ct+Cin)) − (gt+sCt)² = 0.
	const [ga, gt, gi] = [1 / Rs, 1 / Rt, 1 / Rin];
	const exact = quadratic(
		Ct * Cin,
		(ga + gt) * (Ct + Cin) + Ct * gi - gt * Ct,
		ga * gt + ga * gi + gt * gi
	);
	test('exact natural frequencies 1768 Hz and 353.7 MHz (closed form, 1e-9)', () => {
		expect(worstRootError(a.poles, exact)).toBeLessThan(1e-9);
		expect(a.poles[0].hz).toBeCloseTo(1768.4, 1);
		expect(a.poles[1].hz / 1e6).toBeCloseTo(353.68, 2);
	});
	test('open-circuit τ ≈ 9 µs (Ct) and 81 µs (Cin) (closed form, 1e-12)', () => {
		const oc = Object.fromEntries(a.timeConstants.openCircuit.map((t) => [t.element, t.tau]));
		expectRel(oc.Ct, Ct * ((Rt * (Rs + Rin)) / (Rt + Rs + Rin)), 1e-12, 'τ Ct');
		expectRel(oc.Cin, Cin * ((Rin * (Rt + Rs)) / (Rin + Rt + Rs)), 1e-12, 'τ Cin');
	});
	test('sequential estimate ≈ 1965 Hz (from 81 µs) then ≈ 318 MHz (Ct sees 50 Ω ∥ 9 MΩ) (closed form, 1e-10)', () => {
		const [first, second] = a.timeConstants.sequential;
		expect(first.element).toBe('Cin');
		expectRel(first.tau, Cin * ((Rin * (Rt + Rs)) / (Rin + Rt + Rs)), 1e-12, 'first τ');
		expect(second.element).toBe('Ct');
		expectRel(second.tau, Ct * ((Rs * Rt) / (Rs + Rt)), 1e-10, 'second τ');
		const seq = (i: number) => a.poles[i].estimates.find((e) => e.method === 'sequential')!;
		expect(seq(0).hz).toBeCloseTo(1965, 0);
		expect(seq(0).element).toBe('Cin');
		expect(seq(1).hz / 1e6).toBeCloseTo(318.3, 1);
		expectRel(
			seq(0).relativeError,
			Math.abs(-1 / first.tau! - exact[1].re) / Math.abs(exact[1].re),
			1e-8,
			'estimate error'
		);
	});
	test('headline estimates: −1/b1 for the slow pole, b1/b2 for the fast one; the error of −1/b1 is |p1|·b1 − 1 = |p1/p2| exactly (two real poles, b1 = 1/|p1| + 1/|p2|)', () => {
		const [p1, p2] = a.poles;
		expect(p1.estimate!.method).toBe('b1');
		expect(p2.estimate!.method).toBe('ratio');
		const b1 = a.timeConstants.openCircuit.reduce((s, t) => s + t.tau!, 0);
		expectRel(p1.estimate!.re, -1 / b1, 1e-12, '−1/b1');
		// 1/b1 = |p1|·|p2|/(|p1| + |p2|): the relative error against p1 is |p1|/(|p1| + |p2|).
		const [m1, m2] = [Math.abs(exact[1].re), Math.abs(exact[0].re)].sort((x, y) => x - y);
		expectRel(p1.relativeError, m1 / (m1 + m2), 1e-6, 'b1 error');
		// Both real: Q and ζ belong to complex pairs only.
		expect([p1.q, p1.zeta, p1.omega0, p2.q]).toEqual([null, null, null, null]);
	});
	test('compensated (9M·10p = 1M·90p): the slow pole is cancelled by a zero and flagged', () => {
		expect(a.pairs).toHaveLength(1);
		expect(a.poles[0].cancelledBy).toBe(0);
		expect(a.warnings.some((w) => w.code === 'pole_zero_pair')).toBe(true);
		expect(a.poles[0].owners[0].element).toBe('Cin');
		expect(a.poles[1].owners[0].element).toBe('Ct');
	});
	test('DC gain Rin/(Rs+Rt+Rin) and input resistance Rs+Rt+Rin (closed form, 1e-10)', () => {
		expectRel(a.dcGain, Rin / (Rs + Rt + Rin), 1e-10, 'DC gain');
		expectRel(a.inputImpedance!.dc!.re, Rs + Rt + Rin, 1e-10, 'Zin(0)');
	});
});

describe('doubly terminated Butterworth LC ladders (normalized values from memory of filter-design handbook tables)', () => {
	// Element values g_k = 2 sin((2k−1)π/2n) — the handbook tables list them rounded:
	// n = 3: 1, 2, 1; n = 5: 0.618, 1.618, 2, 1.618, 0.618. Poles: e^{jπ(2k+n−1)/2n}, k = 1..n, times ωc.
	const ladder = (g: number[], wc: number, R: number) => {
		const els = [el('Vin', 'V', ['in', 'gnd'], 1), el('Rs', 'R', ['in', 'n0'], R)];
		let node = 'n0';
		g.forEach((gk, k) => {
			if (k % 2 === 0) els.push(el(`C${k + 1}`, 'C', [node, 'gnd'], gk / (wc * R)));
			else {
				const next = `n${k}`;
				els.push(el(`L${k + 1}`, 'L', [node, next], (gk * R) / wc));
				node = next;
			}
		});
		els.push(el('RL', 'R', [node, 'gnd'], R));
		return net(els, node);
	};
	const butterworth = (n: number, wc: number) =>
		Array.from({ length: n }, (_, i) => {
			const th = (Math.PI * (2 * (i + 1) + n - 1)) / (2 * n);
			return { re: wc * Math.cos(th), im: wc * Math.sin(th) };
		});
	for (const n of [3, 5]) {
		test(`n = ${n} from g_k = 2 sin((2k−1)π/2n): poles on the circle at the Butterworth angles (1e-9)`, () => {
			const g = Array.from(
				{ length: n },
				(_, k) => 2 * Math.sin(((2 * k + 1) * Math.PI) / (2 * n))
			);
			const wc = TWO_PI * 1e6;
			const a = analyze(ladder(g, wc, 50));
			expect(worstRootError(a.poles, butterworth(n, wc))).toBeLessThan(1e-9);
			expectRel(a.dcGain, 0.5, 1e-12, 'DC gain of the doubly terminated ladder');
			expectRel(a.bandwidth, 1e6, 1e-8, '−3 dB at ωc');
		});
	}
	test('n = 5 with the table values rounded to 3 decimals: poles within 1e-3 of the ideal ones', () => {
		const a = analyze(ladder([0.618, 1.618, 2, 1.618, 0.618], 1, 1));
		expect(worstRootError(a.poles, butterworth(5, 1))).toBeLessThan(1e-3);
		expect(a.poles).toHaveLength(5);
	});
});

describe('unity-gain Sallen–Key low-pass', () => {
	// Closed form: ω0 = 1/√(R1R2C1C2), Q = √(R1R2C1C2) / (C2(R1+R2)).
	const [R1, R2, C1, C2] = [10e3, 22e3, 10e-9, 1e-9];
	const a = analyze(
		net(
			[
				el('Vin', 'V', ['in', 'gnd'], 1),
				el('R1', 'R', ['in', 'x'], R1),
				el('R2', 'R', ['x', 'y'], R2),
				el('C1', 'C', ['x', 'out'], C1),
				el('C2', 'C', ['y', 'gnd'], C2),
				el('U1', 'OPAMP', ['y', 'out', 'out'])
			],
			'out'
		)
	);
	const w0 = 1 / Math.sqrt(R1 * R2 * C1 * C2);
	const Q = Math.sqrt(R1 * R2 * C1 * C2) / (C2 * (R1 + R2));
	test('ω0 and Q (closed form, 1e-10); DC gain 1', () => {
		expect(a.poles).toHaveLength(2);
		for (const p of a.poles) {
			expectRel(Math.hypot(p.re, p.im), w0, 1e-10, '|p|');
			expectRel(p.q, Q, 1e-10, 'Q');
		}
		expectRel(a.dcGain, 1, 1e-12, 'DC gain');
	});
	test('overshoot of the second-order step: 100·exp(−πζ/√(1−ζ²)) (closed form, 1e-6)', () => {
		const zeta = 1 / (2 * Q);
		expectRel(
			a.step!.overshoot,
			100 * Math.exp((-Math.PI * zeta) / Math.sqrt(1 - zeta * zeta)),
			1e-6,
			'overshoot %'
		);
	});
});

describe('twin-T notch', () => {
	// Closed form: transmission zeros at ±j/(RC) for arms R, R, C/... (R–R with 2C to ground; C–C with R/2 to ground).
	const R = 15e3;
	const C = 4.7e-9;
	const a = analyze(
		net(
			[
				el('Vin', 'V', ['in', 'gnd'], 1),
				el('Ra', 'R', ['in', 'm1'], R),
				el('Rb', 'R', ['m1', 'out'], R),
				el('C2', 'C', ['m1', 'gnd'], 2 * C),
				el('Ca', 'C', ['in', 'm2'], C),
				el('Cb', 'C', ['m2', 'out'], C),
				el('R2', 'R', ['m2', 'gnd'], R / 2),
				el('RL', 'R', ['out', 'gnd'], 1e9)
			],
			'out'
		)
	);
	test('zeros at ±j/(RC) (closed form, 1e-9 relative to 1/RC)', () => {
		const onAxis = a.zeros.filter((z) => Math.abs(z.re) < 1e-6 * Math.abs(z.im));
		expect(onAxis.length).toBe(2);
		for (const z of onAxis) expectRel(Math.abs(z.im), 1 / (R * C), 1e-9, 'notch zero');
		expect(a.poles).toHaveLength(3);
	});
});

describe('RLC series resonance', () => {
	// Closed form: ω0 = 1/√(LC), Q = √(L/C)/R for the voltage across C.
	const [R, L, C] = [20, 1e-3, 100e-9];
	const a = analyze(
		net(
			[
				el('Vin', 'V', ['in', 'gnd'], 1),
				el('R1', 'R', ['in', 'a'], R),
				el('L1', 'L', ['a', 'b'], '1m'),
				el('C1', 'C', ['b', 'gnd'], '100n')
			],
			'b'
		)
	);
	test('ω0, Q (1e-10)', () => {
		expect(a.poles).toHaveLength(2);
		for (const p of a.poles) {
			expectRel(Math.hypot(p.re, p.im), 1 / Math.sqrt(L * C), 1e-10, 'ω0');
			expectRel(p.q, Math.sqrt(L / C) / R, 1e-10, 'Q');
		}
	});
	test('time constants: C sees R (L shorted); L with C open sees ∞ (τ = 0); L with C shorted sees R (τ = L/R)', () => {
		// Closed form of the series loop: D(s) = 1 + sRC + s²LC, so b1 = RC and b2 = LC.
		const oc = Object.fromEntries(a.timeConstants.openCircuit.map((t) => [t.element, t]));
		expectRel(oc.C1.tau, R * C, 1e-12, 'τ_oc C1');
		expect(oc.L1.tau).toBe(0);
		expect(oc.L1.resistance).toBeNull();
		const sc = Object.fromEntries(a.timeConstants.shortCircuit.map((t) => [t.element, t]));
		expectRel(sc.L1.tau, L / R, 1e-12, 'τ_sc L1');
		expectRel(a.expansion!.denominator[0].value, R * C, 1e-10, 'b1');
		expectRel(a.expansion!.denominator[1].value, L * C, 1e-10, 'b2');
		expectRel(a.expansion!.denominator[1].termSum!, L * C, 1e-10, 'b2 from the τ products');
	});
});

describe('lightly damped second-order step: overshoot and 1 % settling', () => {
	// Closed form of the underdamped second-order step (any control-systems text):
	//   y(t) = 1 − e^{−ζωn t} (cos ωd t + ζ/√(1−ζ²) sin ωd t),  ωd = ωn √(1−ζ²),
	//   peak overshoot = exp(−πζ/√(1−ζ²)).
	// The exact settling time (last exit from the ±1 % band) is found here from that formula
	// by dense sampling plus bisection, independently of the solver's own search.
	const [L, C] = [1e-3, 1e-6];
	const wn = 1 / Math.sqrt(L * C);
	for (const zeta of [0.05, 0.01, 0.002]) {
		test(`ζ = ${zeta} (Q = ${1 / (2 * zeta)}): settling 1e-6, overshoot 1e-9`, () => {
			const a = analyze(
				net(
					[
						el('Vin', 'V', ['in', 'gnd'], 1),
						el('R1', 'R', ['in', 'a'], 2 * zeta * Math.sqrt(L / C)),
						el('L1', 'L', ['a', 'out'], L),
						el('C1', 'C', ['out', 'gnd'], C)
					],
					'out'
				)
			);
			const root = Math.sqrt(1 - zeta * zeta);
			const wd = wn * root;
			const y = (t: number) =>
				1 - Math.exp(-zeta * wn * t) * (Math.cos(wd * t) + (zeta / root) * Math.sin(wd * t));
			const outside = (t: number) => Math.abs(y(t) - 1) > 0.01;
			const span = 12 / (zeta * wn);
			const samples = 64 * Math.ceil((span * wd) / (2 * Math.PI));
			let last = 0;
			for (let i = 1; i <= samples; i++) if (outside((span * i) / samples)) last = i;
			let [lo, hi] = [(span * last) / samples, (span * (last + 1)) / samples];
			for (let k = 0; k < 80; k++) {
				const mid = (lo + hi) / 2;
				if (outside(mid)) lo = mid;
				else hi = mid;
			}
			expectRel(a.step!.settlingTime, (lo + hi) / 2, 1e-6, 'settling');
			expectRel(a.step!.overshoot, 100 * Math.exp((-Math.PI * zeta) / root), 1e-9, 'overshoot %');
		});
	}
});
