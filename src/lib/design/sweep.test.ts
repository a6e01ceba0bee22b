import { describe, expect, it } from 'vitest';
import { digitizerDivider } from '../server/db/seed/demo-sheets';
import { axisValues, sweep } from './sweep';
import { metricsCsv } from './table';

describe('sweep', () => {
	it('log and linear axes hit both ends', () => {
		expect(axisValues({ element: 'R', from: 1, to: 100, points: 3, scale: 'log' })).toEqual([
			1, 10, 100
		]);
		expect(axisValues({ element: 'R', from: 1, to: 3, points: 3, scale: 'linear' })).toEqual([
			1, 2, 3
		]);
		expect(() => axisValues({ element: 'R', from: -1, to: 3, points: 3, scale: 'log' })).toThrow(
			/positive/
		);
		expect(() => axisValues({ element: 'R', from: 1, to: 3, points: 1, scale: 'log' })).toThrow(
			/points/
		);
	});

	it('the divider’s zero tracks 1/(2π·Rtop·Ctop) as Ctop moves (closed form of the top arm)', () => {
		const r = sweep(digitizerDivider, {
			axes: [{ element: 'Ctop', from: 2e-12, to: 20e-12, points: 9, scale: 'log' }]
		});
		expect(r.rows).toHaveLength(9);
		for (const row of r.rows) {
			const z = row.metrics!.zeros[0];
			expect(Math.hypot(z.re, z.im) * row.values[0] * 9e6).toBeCloseTo(1, 9);
		}
		// DC gain never moves with a capacitor: 1 MΩ / (9 MΩ + 50 Ω + 1 MΩ) (closed form).
		for (const row of r.rows) expect(row.metrics!.dcGain!).toBeCloseTo(1e6 / (10e6 + 50), 12);
	});

	it('a two-element grid runs the last axis fastest, and CSV has one line per point', () => {
		const r = sweep(digitizerDivider, {
			axes: [
				{ element: 'Ctop', from: 5e-12, to: 8e-12, points: 3, scale: 'linear' },
				{ element: 'Ccable', from: 30e-12, to: 60e-12, points: 4, scale: 'linear' }
			],
			band: { fLo: 10, fHi: 1e6 }
		});
		expect(r.shape).toEqual([3, 4]);
		expect(r.rows.map((x) => x.values)).toContainEqual([5e-12, 30e-12]);
		expect(r.rows[1].values).toEqual([5e-12, 40e-12]);
		const csv = metricsCsv(r.elements, r.rows).trim().split('\r\n');
		expect(csv).toHaveLength(13);
		expect(csv[0]).toMatch(
			/^Ctop,Ccable,dc_gain,bandwidth_hz,.*pole1_re,pole1_im,.*zero1_re.*,error$/
		);
		expect(Number(csv[1].split(',')[7])).toBeGreaterThan(0);
	});

	it('refuses the same element on both axes and too many points', () => {
		const a = { element: 'Ctop', from: 1e-12, to: 1e-11, points: 100, scale: 'log' as const };
		expect(() => sweep(digitizerDivider, { axes: [a, a] })).toThrow(/both axes/);
		expect(() =>
			sweep(digitizerDivider, { axes: [a, { ...a, element: 'Rtop', from: 1e6, to: 1e7 }] })
		).toThrow(/at most 4000/);
	});
});
