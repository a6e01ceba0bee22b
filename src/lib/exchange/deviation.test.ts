import { describe, expect, it } from 'vitest';
import { deviation, modelDbAt } from './deviation';

// A model straight in log-frequency (−20 dB/decade): interpolation on log f is exact on it.
const model = { f: [10, 100, 1000, 10000], magnitudeDb: [0, -20, -40, -60] };

describe('deviation', () => {
	it('interpolates the model linearly in log-frequency', () => {
		expect(modelDbAt(model, Math.sqrt(10 * 100))).toBeCloseTo(-10, 12);
		expect(modelDbAt(model, 5)).toBeNull();
		expect(modelDbAt(model, 10000)).toBe(-60);
	});

	it('gives max and RMS in dB over the band, skipping points the model does not reach', () => {
		const measured = {
			f: [5, 31.6227766, 316.227766, 3162.27766, 20000],
			magnitudeDb: [1, -9, -31, -50, -70]
		};
		const d = deviation(model, measured);
		// Differences: +1, −1, 0 (within rounding), → max 1 dB, RMS sqrt(2/3)
		expect(d.points).toBe(3);
		expect(d.skipped).toBe(2);
		expect(d.maxDb).toBeCloseTo(1, 6);
		expect(d.rmsDb).toBeCloseTo(Math.sqrt(2 / 3), 6);
		const band = deviation(model, measured, { fMin: 100, fMax: 5000 });
		expect(band.points).toBe(2);
		expect(band.fMin).toBeCloseTo(316.227766, 6);
	});

	it('is empty when nothing overlaps', () => {
		expect(deviation(model, { f: [1, 2], magnitudeDb: [0, 0] })).toMatchObject({
			points: 0,
			maxDb: null,
			rmsDb: null
		});
	});
});
