import { describe, expect, it } from 'vitest';
import { logTimeByDefault, stepDomain, stepSamples } from './variant-step-axis';

// A one-pole step y = 1 − e^(−t/τ) (closed form), sampled evenly and at log-spaced times.
const tau = 1e-6;
const y = (t: number) => 1 - Math.exp(-t / tau);
const even = Array.from({ length: 11 }, (_, i) => i * 1e-6);
const logT = [1e-9, 1e-8, 1e-7, 1e-6];
const step = { t: even, y: even.map(y), logSpaced: { t: logT, y: logT.map(y) } };

describe('the variants’ step overlay time axis', () => {
	it('is logarithmic by default when the poles of all variants span more than two decades', () => {
		// The divider: 2.6 kHz and 520 MHz (five decades) in one variant.
		expect(
			logTimeByDefault([
				[
					{ re: -1.66e4, im: 0 },
					{ re: -3.27e9, im: 0 }
				]
			])
		).toBe(true);
		// Two one-pole variants a decade apart each, but three decades apart together.
		expect(logTimeByDefault([[{ re: -1e3, im: 0 }], [{ re: -1e6, im: 0 }]])).toBe(true);
		// A 3-section RC ladder: 31.5 kHz to 517 kHz, 16×.
		expect(
			logTimeByDefault([
				[
					{ re: -1.98e5, im: 0 },
					{ re: -3.25e6, im: 0 }
				]
			])
		).toBe(false);
		expect(logTimeByDefault([])).toBe(false);
	});

	it('linear: the even samples as they are, from 0', () => {
		expect(stepSamples(step, false)).toEqual({ t: step.t, y: step.y });
		expect(stepDomain([step], false)).toEqual([0, even[10]]);
	});

	it('log: even and log-spaced samples merged in order, without t = 0; the domain starts at the first', () => {
		const s = stepSamples(step, true);
		expect(s.t[0]).toBe(1e-9);
		expect(s.t).not.toContain(0);
		for (let i = 1; i < s.t.length; i++) expect(s.t[i]).toBeGreaterThanOrEqual(s.t[i - 1]);
		s.t.forEach((t, i) => expect(s.y[i]).toBeCloseTo(y(t), 12));
		expect(stepDomain([s, stepSamples({ t: even, y: even.map(y) }, true)], true)).toEqual([
			1e-9,
			even[10]
		]);
	});
});
