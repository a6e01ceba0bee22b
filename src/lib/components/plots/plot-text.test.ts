import { describe, expect, it } from 'vitest';
import { frequencySummary, spreadIndices, stepSummary } from './plot-text';

describe('plots in words', () => {
	it('spreads sample rows evenly on a log axis, first and last included, none twice', () => {
		const f = Array.from({ length: 201 }, (_, i) => 10 ** (1 + (8 * i) / 200)); // 10 Hz … 1 GHz
		const rows = spreadIndices(f, 9, true);
		expect(rows[0]).toBe(0);
		expect(rows[rows.length - 1]).toBe(200);
		expect(rows).toEqual([0, 25, 50, 75, 100, 125, 150, 175, 200]); // one row a decade
		expect(new Set(rows).size).toBe(rows.length);
		expect(spreadIndices([1, 2, 3], 10)).toEqual([0, 1, 2]);
		expect(spreadIndices([0, 1, 10, 100], 2, true)).toEqual([1, 3]); // 0 has no place on a log axis
	});

	it('says a one-pole low-pass in one line: DC level, −3 dB point, top end, phase', () => {
		// One pole at 1 kHz (closed form |H| = 1/√(1 + (f/fc)²), phase −atan(f/fc)).
		const f = [10, 1e3, 1e5];
		const mag = f.map((x) => -10 * Math.log10(1 + (x / 1e3) ** 2));
		const ph = f.map((x) => (-Math.atan(x / 1e3) * 180) / Math.PI);
		expect(frequencySummary({ f, magnitudeDb: mag, phaseDeg: ph, bandwidth: 1e3 })).toBe(
			'Magnitude 0.0 dB at 10 Hz, −3 dB at 1 kHz, −40.0 dB at 100 kHz; phase −1° to −89°.'
		);
		expect(
			frequencySummary({ f: [1], magnitudeDb: [null], phaseDeg: [null], bandwidth: null })
		).toMatch(/^No frequency response/);
	});

	it('says the step figures in words, and what is missing', () => {
		expect(stepSummary({ riseTime: 2.2e-6, overshoot: 4.3, settlingTime: 9e-6, final: 0.1 })).toBe(
			'Rises 10–90 % in 2.2 µs, overshoots 4.3 %, settles within 1 % by 9 µs; final value 0.1000.'
		);
		expect(stepSummary({ riseTime: null, overshoot: 1e-12, settlingTime: null, final: null })).toBe(
			'No 10–90 % rise in the time shown, no overshoot, does not settle within 1 % in the time shown.'
		);
	});
});
