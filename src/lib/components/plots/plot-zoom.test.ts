import { describe, expect, it } from 'vitest';
import {
	alignPhase,
	crossing,
	frequencyWindow,
	poleSpan,
	timeWindow,
	valueRange
} from './plot-zoom';

// A one-pole step y = 1 − e^(−t/τ) sampled densely: 10–90 % rise is τ·ln 9 (closed form).
const tau = 1e-6;
const t = Array.from({ length: 5001 }, (_, i) => (i * 50 * tau) / 5000);
const step = {
	t,
	y: t.map((x) => 1 - Math.exp(-x / tau)),
	riseTime: tau * Math.log(9),
	settlingTime: tau * Math.log(100),
	final: 1
};

describe('plot zoom', () => {
	it('crossings of 10 % and 90 % at τ·ln(10/9) and τ·ln 10 (closed form; 1e-3 for linear interpolation between samples τ/100 apart)', () => {
		expect(Math.abs(crossing(step, 0.1)! / (tau * Math.log(10 / 9)) - 1)).toBeLessThan(1e-3);
		expect(Math.abs(crossing(step, 0.9)! / (tau * Math.log(10)) - 1)).toBeLessThan(1e-3);
	});
	it('the edge window holds the whole 10–90 % rise; the tail starts after it and runs to the end', () => {
		const [a, b] = timeWindow(step, 'edge', false);
		expect(a).toBeLessThanOrEqual(tau * Math.log(10 / 9));
		expect(b).toBeGreaterThan(tau * Math.log(10));
		const [c, d] = timeWindow(step, 'tail', false);
		expect(c).toBe(b);
		expect(d).toBe(t[t.length - 1]);
		expect(timeWindow(step, 'all', true)[0]).toBe(t[1]); // a log axis starts above 0
	});
	it('a time window maps to the frequencies 1/(2πt) at its ends, inside the plotted range', () => {
		const [lo, hi] = frequencyWindow([1e-9, 1e-3], 1, 1e12);
		expect(lo).toBeCloseTo(1 / (2 * Math.PI * 1e-3), 6);
		expect(hi).toBeCloseTo(1 / (2 * Math.PI * 1e-9), -3);
		expect(frequencyWindow([0, 1e-3], 1, 1e6)[1]).toBe(1e6);
	});
	it('the tail view keeps the final value ±1 % on screen', () => {
		const [lo, hi] = valueRange(step, timeWindow(step, 'tail', false), 'tail');
		expect(lo).toBeLessThan(0.99);
		expect(hi).toBeGreaterThan(1.01);
	});
	it('span of the poles: fastest over slowest magnitude', () => {
		expect(
			poleSpan([
				{ re: -10, im: 0 },
				{ re: -3, im: 4 },
				{ re: -1e4, im: 0 }
			])
		).toBe(2000);
		expect(poleSpan([])).toBe(1);
	});
	it('measured phase wrapped to ±180° is unwrapped and lifted onto the model (whole turns)', () => {
		const f = [1, 10, 100, 1000];
		const model = [-170, -190, -260, -350];
		const measured = [-171, 169, 101, 11]; // the same curve, wrapped
		expect(alignPhase(f, measured, f, model)).toEqual([-171, -191, -259, -349]);
	});
});
