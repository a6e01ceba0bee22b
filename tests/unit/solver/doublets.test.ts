// Pole–zero doublets: the slow tail they leave in the step response and the element change that
// closes them, against closed forms.
import { describe, expect, test } from 'vitest';
import { analyze } from '../../../src/lib/solver/index';
import { digitizerDivider } from '../../../src/lib/server/db/seed/demo-sheets';
import { el, expectRel, net, quadratic } from './helpers';

describe('one pole and one zero: the lag network (textbook partial fractions)', () => {
	// Vin–R1–out, out–R2–x, x–C–gnd: H = (1 + s·R2·C)/(1 + s·(R1 + R2)·C), DC gain 1. The step
	// is y(t) = 1 − (1 − p/z)·e^{pt}, so the tail is (p − z)/z of the final value.
	const [R1, R2, C] = [1e3, 20e3, 1e-9];
	const lag = net(
		[
			el('Vin', 'V', ['in', 'gnd'], 1),
			el('R1', 'R', ['in', 'out'], R1),
			el('R2', 'R', ['out', 'x'], R2),
			el('C', 'C', ['x', 'gnd'], C)
		],
		'out'
	);
	const a = analyze(lag);
	const p = -1 / ((R1 + R2) * C);
	const z = -1 / (R2 * C);
	test('one doublet, (z − p)/p = R1/R2 = 5 %, tail (p − z)/z = −1/21, τ = (R1 + R2)·C (closed form, 1e-9)', () => {
		expect(a.doublets).toHaveLength(1);
		const d = a.doublets[0];
		expectRel(d.separation, (z - p) / p, 1e-9, 'separation');
		expectRel(d.separation, R1 / R2, 1e-9, 'R1/R2');
		expectRel(d.tail, (p - z) / z, 1e-9, 'tail');
		expectRel(d.tailTau, (R1 + R2) * C, 1e-9, 'τ');
	});
	test('the tail is what the step response shows: y(τ) = 1 + tail·e^(−1) (1e-9)', () => {
		const tau = (R1 + R2) * C;
		const b = analyze(lag, { step: { tEnd: 2 * tau, points: 201 } });
		expectRel(b.step!.t[100], tau, 1e-12, 'sample at τ');
		expectRel(b.step!.y[100], 1 + b.doublets[0].tail! * Math.exp(-1), 1e-9, 'y(τ)');
	});
	test('no single value closes it (C moves pole and zero together; R1 would have to vanish): said so', () => {
		expect(a.doublets[0].closing).toEqual([]);
		expect(a.doublets[0].closingNote).toMatch(/no single element value/);
	});
	test('the ratio is settable: at 4 % the 5 % pair is not a doublet', () => {
		expect(analyze(lag, { doubletRatio: 0.04 }).doublets).toEqual([]);
		expect(analyze(lag, { doubletRatio: 0.06 }).doublets).toHaveLength(1);
	});
});

describe('the demo divider: its 1.8 % mismatch is a doublet, closed by Ctop (compensation R·C equal on both arms: common practice)', () => {
	const a = analyze(digitizerDivider);
	const [Rs, Rt, Ct, Rb, Cb] = [50, 9e6, 6.8e-12, 1e6, 60e-12];
	// Closed forms of the two-node network (as in the probe test): poles from
	// (gs+gt+sCt)(gt+gb+s(Ct+Cb)) − (gt+sCt)² = 0; the zero at −1/(Rt·Ct).
	const [gs, gt, gb] = [1 / Rs, 1 / Rt, 1 / Rb];
	const roots = quadratic(
		Ct * Cb,
		(gs + gt) * (Ct + Cb) + Ct * gb - gt * Ct,
		gs * gt + gs * gb + gt * gb
	)
		.map((r) => r.re)
		.sort((x, y) => Math.abs(x) - Math.abs(y));
	const z = -1 / (Rt * Ct);
	test('doublet p1–z1 with (z − p)/p ≈ −1.8 % and the partial-fraction tail (1 − p1/z)/(1 − p1/p2), negated (1e-8)', () => {
		expect(a.doublets).toHaveLength(1);
		const d = a.doublets[0];
		const [p1, p2] = roots;
		expectRel(d.separation, (z - p1) / p1, 1e-8, 'separation');
		expectRel(d.tail, -(1 - p1 / z) / (1 - p1 / p2), 1e-8, 'tail');
		expect(d.tail!).toBeGreaterThan(0.017); // the 1.8 % overshoot the step shows
		expectRel(a.step!.overshoot! / 100, d.tail!, 2e-2, 'overshoot ≈ tail');
	});
	test('closing change: Ctop → Radc·(Ccable + Cadc)/Rtop = 6.6667 pF (−1.96 %), Rtop and Radc as alternatives (1e-9)', () => {
		const [first, ...others] = a.doublets[0].closing;
		expect(first.element).toBe('Ctop');
		expectRel(first.to, (Rb * Cb) / Rt, 1e-9, 'Ctop');
		expectRel(first.change, (Rb * Cb) / (Rt * Ct) - 1, 1e-8, 'change');
		const rtop = others.find((c) => c.element === 'Rtop');
		expectRel(rtop?.to, (Rb * Cb) / Ct, 1e-9, 'Rtop');
	});
});
