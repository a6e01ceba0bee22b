import { describe, expect, it } from 'vitest';
import { decadeTicks, linePath, nearest } from './ticks';

describe('plot helpers', () => {
	it('decade ticks with 2 and 5 between over a short span', () => {
		expect(decadeTicks(10, 1000).map((t) => t.value)).toEqual([10, 20, 50, 100, 200, 500, 1000]);
	});
	it('decades only over a long span', () => {
		expect(decadeTicks(1, 1e9).every((t) => t.major)).toBe(true);
	});
	it('nearest sample by bisection', () => {
		expect(nearest([1, 2, 4, 8], 5.5)).toBe(2);
		expect(nearest([1, 2, 4, 8], 7)).toBe(3);
	});
	it('a null value breaks the line', () => {
		expect(
			linePath(
				[1, 2, 3],
				[1, null, 3],
				(x) => x,
				(y) => y
			)
		).toBe('M1.0 1.0M3.0 3.0');
	});
});
