// When the poles span more than two decades the step carries log-spaced samples from a
// hundredth of the fastest time constant, so a log time axis shows the edge.
import { describe, expect, test } from 'vitest';
import { analyze } from '../../../src/lib/solver/index';
import { el, probe10x, quadratic } from './helpers';

describe('log-spaced step samples (10:1 probe, poles 1768 Hz and 353.7 MHz: 5.3 decades)', () => {
	const a = analyze(probe10x(), { step: { points: 101 } });
	const s = a.step!;
	test('t keeps the requested 101 even samples; logSpaced ascends from a hundredth of the fastest time constant to the end, 24 a decade', () => {
		expect(s.t).toHaveLength(101);
		const l = s.logSpaced!;
		for (let i = 1; i < l.t.length; i++) expect(l.t[i]).toBeGreaterThan(l.t[i - 1]);
		const fastest = Math.max(...a.poles.map((p) => Math.hypot(p.re, p.im)));
		expect(l.t[0]).toBeCloseTo(1 / fastest / 100, 20);
		expect(l.t[l.t.length - 1]).toBeCloseTo(s.t[100], 15);
		expect(l.t.length).toBeGreaterThanOrEqual(Math.log10(s.t[100] * fastest * 100) * 24);
	});
	test('every sample equals the two-pole, one-zero step by partial fractions (closed form, 1e-9 of the final value)', () => {
		const [Rs, Rt, Ct, Rin, Cin] = [50, 9e6, 10e-12, 1e6, 90e-12];
		const [ga, gt, gi] = [1 / Rs, 1 / Rt, 1 / Rin];
		const [p1, p2] = quadratic(
			Ct * Cin,
			(ga + gt) * (Ct + Cin) + Ct * gi - gt * Ct,
			ga * gt + ga * gi + gt * gi
		).map((r) => r.re);
		const z = -1 / (Rt * Ct);
		const h0 = Rin / (Rs + Rt + Rin);
		const y = (t: number) =>
			h0 *
			(1 -
				((1 - p1 / z) / (1 - p1 / p2)) * Math.exp(p1 * t) -
				((1 - p2 / z) / (1 - p2 / p1)) * Math.exp(p2 * t));
		let worst = 0;
		s.t.forEach((t, i) => (worst = Math.max(worst, Math.abs(s.y[i] - y(t)) / h0)));
		s.logSpaced!.t.forEach(
			(t, i) => (worst = Math.max(worst, Math.abs(s.logSpaced!.y[i] - y(t)) / h0))
		);
		expect(worst).toBeLessThan(1e-9);
	});
	test('a single pole (no span) has no log-spaced samples', () => {
		const b = analyze(
			{
				schema: 1,
				elements: [
					el('Vin', 'V', ['a', 'gnd'], 1),
					el('R', 'R', ['a', 'b'], '1k'),
					el('C', 'C', ['b', 'gnd'], '1n')
				],
				input: 'Vin',
				output: { node: 'b' }
			},
			{ step: { points: 101 } }
		);
		expect(b.step!.t).toHaveLength(101);
		expect(b.step!.logSpaced).toBeUndefined();
	});
});
