import { describe, expect, it } from 'vitest';
import { figureValue, spreadValue, summaryLine } from './figure-text';
import { statistics } from '$lib/design/statistics';
import { findClusters } from '$lib/design/clusters';

describe('figure text of a tolerance run', () => {
	it('a gain is plain, with dB — not "98.37m"', () => {
		expect(figureValue(0.09837, '')).toBe('0.09837 (−20.14 dB)');
		expect(figureValue(0.09837, '')).not.toMatch(/m\b/);
	});
	it('a gain’s σ is plain and a share of the mean — not "σ 739µ"', () => {
		expect(spreadValue(0.000739, 0.09837, '')).toBe('0.000739 (0.75 % of the mean)');
	});
	it('figures with units keep engineering notation', () => {
		expect(figureValue(1.768e3, 'Hz')).toBe('1.768 kHz');
		expect(figureValue(2.5, '%')).toBe('2.5 %');
	});
	it('one population: mean, σ and percentiles', () => {
		const xs = Array.from({ length: 101 }, (_, i) => 0.098 + i * 1e-5);
		const line = summaryLine({ stats: statistics(xs), clusters: findClusters(xs) }, '');
		expect(line).toMatch(/^mean 0\.0985 \(−20\.13 dB\) · σ /);
		expect(line).toContain('1 %, 50 %, 99 % of runs:');
	});
	it('two clusters: said as such, with no mean ± σ', () => {
		const xs = [...Array(50).fill(415e-12), ...Array(50).fill(27e-6)].map(
			(x, i) => x * (1 + (i % 7) * 1e-3)
		);
		const line = summaryLine({ stats: statistics(xs), clusters: findClusters(xs) }, 's');
		expect(line).toMatch(/^Not one population — two clusters: 50 % near 41\d\.\d ps/);
		expect(line).toContain('50 % near 27.');
		expect(line).not.toContain('13.5 µs'); // the interpolated median, in the gap
		expect(line).not.toMatch(/mean|σ/);
	});
});
