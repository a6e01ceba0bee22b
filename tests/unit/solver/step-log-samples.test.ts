// When the poles span more than two decades the step carries log-spaced samples from a
// hundredth of the fastest time constant, so a log time axis shows the edge.
import { describe, expect, test } from 'vitest';
import { analyze } from '../../../src/lib/solver/index';
import { el, probe10x, quadratic } from './helpers';

describe('log-spaced step samples (10:1 probe, poles 1768 Hz and 353.7 MHz: 5.3 decades)', () => {
	const a = analyze(probe10x(), { step: { points: 101 } });
	const s = a.step!;
	test('t starts at 0, ascends, and has samples well before the 10 % point', () => {
		expect(s.t[0]).toBe(0);
		for (let i = 1; i < s.t.length; i++) expect(s.t[i]).toBeGreaterThan(s.t[i - 1]);
		expect(s.t.length).toBeGreaterThan(101 + 100);
		const fastest = Math.max(...a.poles.map((p) => Math.hypot(p.re, p.im)));
		expect(s.t[1]).toBeLessThanOrEqual(1.0001 / fastest / 100);
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
		expect(worst).toBeLessThan(1e-9);
	});
	test('a single pole (no span) keeps the plain linear list', () => {
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
	});
});
