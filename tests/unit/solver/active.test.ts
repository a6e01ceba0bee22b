import { describe, expect, test } from 'vitest';
import { analyze } from '../../../src/lib/solver/index';
import { el, expectRel, net, quadratic, worstRootError } from './helpers';

describe('controlled sources and the ideal op-amp (closed forms of the textbook stages)', () => {
	test('inverting amplifier: gain −R2/R1, input resistance R1 (1e-12)', () => {
		const a = analyze(
			net(
				[
					el('Vin', 'V', ['in', 'gnd'], 1),
					el('R1', 'R', ['in', 'm'], '10k'),
					el('R2', 'R', ['m', 'out'], '47k'),
					el('U1', 'OPAMP', ['gnd', 'm', 'out'])
				],
				'out'
			)
		);
		expectRel(a.dcGain, -4.7, 1e-12, 'gain');
		expectRel(a.inputImpedance!.dc!.re, 10e3, 1e-12, 'Zin');
		expect(a.poles).toHaveLength(0);
	});
	test('integrator: one pole at s = 0, so dcGain is null; |H(jω)| = 1/(ωRC) (1e-9)', () => {
		const a = analyze(
			net(
				[
					el('Vin', 'V', ['in', 'gnd'], 1),
					el('R1', 'R', ['in', 'm'], '10k'),
					el('C1', 'C', ['m', 'out'], '1n'),
					el('U1', 'OPAMP', ['gnd', 'm', 'out'])
				],
				'out'
			),
			{ frequency: { fMin: 1e3, fMax: 1e5, points: 3 } }
		);
		expect(a.poles).toHaveLength(1);
		expect(a.poles[0].re).toBe(0);
		expect(a.dcGain).toBeNull();
		expect(a.bandwidth).toBeNull();
		expect(a.timeConstants.openCircuit[0].tau).toBeNull();
		const f = a.frequencyResponse!.f[1];
		expectRel(
			10 ** (a.frequencyResponse!.magnitudeDb[1]! / 20),
			1 / (2 * Math.PI * f * 10e3 * 1e-9),
			1e-9,
			'|H|'
		);
		expectRel(a.frequencyResponse!.phaseDeg[1]!, 90, 1e-9, 'phase of −1/(jωRC)');
	});
	test('differentiator (C into the virtual ground, R feedback): H = −sRC, one zero at 0, no finite pole (closed form, 1e-9)', () => {
		const a = analyze(
			net(
				[
					el('Vin', 'V', ['in', 'gnd'], 1),
					el('C1', 'C', ['in', 'm'], '10n'),
					el('R1', 'R', ['m', 'out'], '10k'),
					el('U1', 'OPAMP', ['gnd', 'm', 'out'])
				],
				'out'
			),
			{ frequency: { fMin: 100, fMax: 1e4, points: 3 } }
		);
		expect(a.poles).toHaveLength(0);
		expect(a.zeros).toHaveLength(1);
		expect(a.zeros[0].hz).toBe(0);
		const f = a.frequencyResponse!.f[1];
		expectRel(
			10 ** (a.frequencyResponse!.magnitudeDb[1]! / 20),
			2 * Math.PI * f * 10e3 * 10e-9,
			1e-9,
			'|H| = ωRC'
		);
	});
	test('an all-pole active filter reports no spurious zeros (regression: relative degree 3)', () => {
		const a = analyze(
			net(
				[
					el('Vin', 'V', ['in', 'gnd'], 1),
					el('Rs', 'R', ['in', 'x'], 220),
					el('R1', 'R', ['x', 'y'], 1.8e3),
					el('R2', 'R', ['y', 'z'], 3.3e3),
					el('C1', 'C', ['y', 'out'], 2.7e-9),
					el('C2', 'C', ['z', 'gnd'], 680e-12),
					el('U1', 'OPAMP', ['z', 'out', 'out']),
					el('Riso', 'R', ['out', 'adc'], 47),
					el('Cadc', 'C', ['adc', 'gnd'], 1.5e-9)
				],
				'adc'
			)
		);
		expect(a.poles).toHaveLength(3);
		expect(a.zeros).toHaveLength(0);
		// The buffered RC at the output is exact: −1/(Riso·Cadc).
		expectRel(a.poles[2].re, -1 / (47 * 1.5e-9), 1e-10, 'output pole');
	});
	test('VCVS follower with gain A across a divider: A·R2/(R1+R2) (1e-12)', () => {
		const a = analyze(
			net(
				[
					el('Vin', 'V', ['in', 'gnd'], 1),
					el('R1', 'R', ['in', 'a'], 3e3),
					el('R2', 'R', ['a', 'gnd'], 1e3),
					el('E1', 'VCVS', ['out', 'gnd', 'a', 'gnd'], 20),
					el('RL', 'R', ['out', 'gnd'], 100)
				],
				'out'
			)
		);
		expectRel(a.dcGain, 5, 1e-12, 'gain');
	});
	test('VCCS into R ∥ C: −gm·R/(1 + sRC): DC gain −gm·R and pole −1/RC (1e-12)', () => {
		const a = analyze(
			net(
				[
					el('Vin', 'V', ['in', 'gnd'], 1),
					el('G1', 'VCCS', ['out', 'gnd', 'in', 'gnd'], '2m'),
					el('RL', 'R', ['out', 'gnd'], '5k'),
					el('CL', 'C', ['out', 'gnd'], '1n')
				],
				'out'
			)
		);
		expectRel(a.dcGain, -10, 1e-12, 'gain');
		expectRel(a.poles[0].re, -1 / (5e3 * 1e-9), 1e-12, 'pole');
	});
	test('CCCS and CCVS sensing a 0 V source: −β·RL/R1 and r/R1 (1e-12)', () => {
		const base = [
			el('Vin', 'V', ['in', 'gnd'], 1),
			el('R1', 'R', ['in', 'x'], 2e3),
			el('Vs', 'V', ['x', 'gnd'], 0)
		];
		const f = analyze(
			net(
				[...base, el('F1', 'CCCS', ['out', 'gnd'], 50, 'Vs'), el('RL', 'R', ['out', 'gnd'], 1e3)],
				'out'
			)
		);
		expectRel(f.dcGain, (-50 * 1e3) / 2e3, 1e-12, 'CCCS gain');
		const h = analyze(
			net(
				[
					...base,
					el('H1', 'CCVS', ['out', 'gnd'], '10k', 'Vs'),
					el('RL', 'R', ['out', 'gnd'], 1e3)
				],
				'out'
			)
		);
		expectRel(h.dcGain, 10e3 / 2e3, 1e-12, 'CCVS gain');
	});
	test('current input into R ∥ C: transfer impedance R/(1 + sRC), input impedance R (1e-12)', () => {
		const a = analyze(
			net(
				[
					el('Iin', 'I', ['a', 'gnd'], 1),
					el('R1', 'R', ['a', 'gnd'], '1M'),
					el('C1', 'C', ['a', 'gnd'], '1p')
				],
				'a',
				'Iin'
			)
		);
		expectRel(a.dcGain, 1e6, 1e-12, 'transimpedance');
		expectRel(a.inputImpedance!.dc!.re, 1e6, 1e-12, 'Zin');
		expectRel(a.poles[0].re, -1e6, 1e-12, 'pole');
	});
	test('current direction conventions: I pushes into p; VCCS current leaves p (format definition)', () => {
		const a = analyze(
			net([el('Iin', 'I', ['gnd', 'a'], 1), el('R1', 'R', ['a', 'gnd'], 1e3)], 'a', 'Iin')
		);
		expectRel(a.dcGain, -1e3, 1e-12, 'I with p = gnd pulls current out of a');
	});
});

describe('poles over ten decades', () => {
	test('buffered RC sections, τ = 100 ps … 1 s: each pole −1/RC (1e-9)', () => {
		const taus = [
			[100, 1e-12],
			[1e3, 100e-12],
			[10e3, 100e-9],
			[1e6, 1e-6]
		];
		const els = [el('Vin', 'V', ['n0', 'gnd'], 1)];
		taus.forEach(([R, C], i) => {
			els.push(el(`R${i}`, 'R', [`n${i}`, `a${i}`], R), el(`C${i}`, 'C', [`a${i}`, 'gnd'], C));
			els.push(el(`E${i}`, 'VCVS', [`n${i + 1}`, 'gnd', `a${i}`, 'gnd'], 1));
		});
		const a = analyze(net(els, `n${taus.length}`));
		expect(
			worstRootError(
				a.poles,
				taus.map(([R, C]) => ({ re: -1 / (R * C), im: 0 }))
			)
		).toBeLessThan(1e-9);
		// Sorted by magnitude: the slowest (C3, 1 s) first.
		a.poles.forEach((p, i) => expect(p.owners[0].element).toBe(`C${taus.length - 1 - i}`));
	});
	test('passive two-section ladder with poles 10¹⁰ apart: the closed-form quadratic (1e-9)', () => {
		const [R1, C1, R2, C2] = [10, 10e-12, 1e6, 1e-6];
		const a = analyze(
			net(
				[
					el('Vin', 'V', ['in', 'gnd'], 1),
					el('R1', 'R', ['in', 'a'], R1),
					el('C1', 'C', ['a', 'gnd'], C1),
					el('R2', 'R', ['a', 'b'], R2),
					el('C2', 'C', ['b', 'gnd'], C2)
				],
				'b'
			)
		);
		const [g1, g2] = [1 / R1, 1 / R2];
		const exact = quadratic(C1 * C2, C1 * g2 + C2 * (g1 + g2), g1 * g2);
		expect(Math.abs(exact[0].re / exact[1].re)).toBeGreaterThan(1e9);
		expect(worstRootError(a.poles, exact)).toBeLessThan(1e-9);
		expectRel(a.dcGain, 1, 1e-12, 'DC gain');
	});
});

describe('degenerate structures the shift-and-invert reduction must survive', () => {
	test('capacitor loop (three capacitors in a triangle): one infinite natural frequency drops out', () => {
		// Closed form: a, b joined by C3 and each to ground by R, C: the loop C1–C3–C2 removes one
		// natural frequency, so two remain; Σ τ_oc = −Σ 1/p still holds (published identity, b1).
		const a = analyze(
			net(
				[
					el('Vin', 'V', ['in', 'gnd'], 1),
					el('R1', 'R', ['in', 'a'], 1e3),
					el('C1', 'C', ['a', 'gnd'], 1e-9),
					el('C3', 'C', ['a', 'b'], 2e-9),
					el('C2', 'C', ['b', 'gnd'], 3e-9),
					el('R2', 'R', ['b', 'gnd'], 5e3)
				],
				'b'
			)
		);
		expect(a.poles).toHaveLength(2);
		const b1 = a.timeConstants.openCircuit.reduce((s, t) => s + t.tau!, 0);
		expectRel(-a.poles.reduce((s, p) => s + 1 / p.re, 0), b1, 1e-9, 'Σ τ_oc = −Σ 1/p');
		// Every capacitor of the loop is shorted by the other two: τ_sc = 0 for all three.
		expect(a.timeConstants.shortCircuit.every((t) => t.tau === 0)).toBe(true);
	});
	test('node reached only by capacitors: a pole at the origin, dcGain null, τ of that capacitor null', () => {
		const a = analyze(
			net(
				[
					el('Vin', 'V', ['in', 'gnd'], 1),
					el('R1', 'R', ['in', 'a'], 1e3),
					el('C1', 'C', ['a', 'm'], 1e-9),
					el('C2', 'C', ['m', 'gnd'], 1e-9),
					el('R2', 'R', ['a', 'gnd'], 1e3)
				],
				'm'
			)
		);
		expect(a.poles.some((p) => p.re === 0 && p.im === 0)).toBe(true);
		expect(a.dcGain).toBeNull();
		expect(a.timeConstants.openCircuit.every((t) => t.tau === null)).toBe(true);
		// Closed form of the capacitive divider: H(s) = C1/(C1+C2) · … with the non-zero pole −1/(R1∥R2 · (C1 series C2)).
		const p = a.poles.find((q) => q.re !== 0)!;
		expectRel(p.re, -1 / (500 * 0.5e-9), 1e-10, 'non-zero pole');
	});
});
