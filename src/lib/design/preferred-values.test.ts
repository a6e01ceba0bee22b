import { describe, expect, it } from 'vitest';
import { decadeValues, SERIES, snapToSeries } from './preferred-values';

describe('IEC 60063 series', () => {
	// Series lengths: n values per decade is the definition of the En series (IEC 60063).
	it.each(SERIES.map((s) => [s, Number(s.slice(1))] as const))(
		'%s has %i values per decade, rising',
		(series, n) => {
			const values = decadeValues(series);
			expect(values).toHaveLength(n);
			for (let i = 1; i < n; i++) expect(values[i]).toBeGreaterThan(values[i - 1]);
			expect(values[0]).toBe(1);
			expect(values[n - 1]).toBeLessThan(10);
		}
	);

	// Each series is every other value of the next finer one (E6 ⊂ E12 ⊂ E24, E48 ⊂ E96 ⊂ E192):
	// a property of how IEC 60063 builds the series.
	it.each([
		['E3', 'E6'],
		['E6', 'E12'],
		['E12', 'E24'],
		['E48', 'E96'],
		['E96', 'E192']
	] as const)('%s is every other value of %s', (coarse, fine) => {
		expect(decadeValues(fine).filter((_, i) => i % 2 === 0)).toEqual(decadeValues(coarse));
	});

	// Spot values from memory of the IEC 60063 tables.
	it.each([
		['E24', [2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2, 9.1]],
		['E96', [1.0, 1.02, 1.05, 1.5, 4.99, 9.76]],
		['E192', [1.01, 4.99, 9.2, 9.88]],
		['E48', [1.0, 1.05, 4.64, 9.53]]
	] as const)('%s contains the tabulated values', (series, values) => {
		for (const v of values) expect(decadeValues(series)).toContain(v);
	});

	it('E192 carries the standard’s exception 9.20, not the rounded 9.19', () => {
		expect(decadeValues('E192')).toContain(9.2);
		expect(decadeValues('E192')).not.toContain(9.19);
	});
});

describe('snapping a value to a series', () => {
	it('finds the neighbours on both sides and the nearer by ratio', () => {
		// 6.667 pF (exact divider compensation) in E12: 5.6 pF and 6.8 pF; 6.8 is nearer.
		const s = snapToSeries(6.667e-12, 'E12');
		expect(s.below).toBeCloseTo(5.6e-12, 20);
		expect(s.above).toBeCloseTo(6.8e-12, 20);
		expect(s.nearest).toBe(s.above);
	});

	it('keeps a value that is already on the series', () => {
		expect(snapToSeries(4.7e3, 'E6')).toEqual({ below: 4700, above: 4700, nearest: 4700 });
	});

	it('crosses a decade boundary (9.5 in E12 lies between 8.2 and 10)', () => {
		expect(snapToSeries(9.5, 'E12')).toEqual({ below: 8.2, above: 10, nearest: 10 });
	});

	it.each([0, -1, Infinity, NaN])('refuses %s with a message', (v) => {
		expect(() => snapToSeries(v, 'E24')).toThrow(
			'a preferred value needs a positive finite number'
		);
	});
});

describe('the whole E96 decade', () => {
	// The E96 table as printed in IEC 60063 (from memory; it also equals the three-figure rounding
	// of 10^(i/96), which is how the standard defines the E48–E192 series).
	const table =
		'1.00 1.02 1.05 1.07 1.10 1.13 1.15 1.18 1.21 1.24 1.27 1.30 1.33 1.37 1.40 1.43 1.47 1.50 1.54 1.58 1.62 1.65 1.69 1.74 1.78 1.82 1.87 1.91 1.96 2.00 2.05 2.10 2.15 2.21 2.26 2.32 2.37 2.43 2.49 2.55 2.61 2.67 2.74 2.80 2.87 2.94 3.01 3.09 3.16 3.24 3.32 3.40 3.48 3.57 3.65 3.74 3.83 3.92 4.02 4.12 4.22 4.32 4.42 4.53 4.64 4.75 4.87 4.99 5.11 5.23 5.36 5.49 5.62 5.76 5.90 6.04 6.19 6.34 6.49 6.65 6.81 6.98 7.15 7.32 7.50 7.68 7.87 8.06 8.25 8.45 8.66 8.87 9.09 9.31 9.53 9.76';
	it('matches the table value by value', () => {
		expect(decadeValues('E96')).toEqual(table.split(' ').map(Number));
	});
});
