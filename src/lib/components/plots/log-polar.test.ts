import { describe, expect, it } from 'vitest';
import { logPolar } from './log-polar';

describe('log-polar scale', () => {
	it('one ring per decade from the smallest to the largest magnitude; angles kept', () => {
		const s = logPolar([2e3, 3.5e8, 0, Infinity], 300);
		expect(s.rings).toEqual([3, 4, 5, 6, 7, 8, 9]);
		expect(s.radius(1e3)).toBe(22); // the innermost ring
		expect(s.radius(1e9)).toBe(150 - 18); // the outermost
		expect(s.radius(0)).toBe(0);
		// A pole on the negative real axis sits left of the centre, one at +j above it.
		expect(s.place(-1e6, 0).x).toBeLessThan(s.c);
		expect(s.place(-1e6, 0).y).toBeCloseTo(s.c, 9);
		expect(s.place(0, 1e6).y).toBeLessThan(s.c);
	});

	it('nothing to place: one decade around 1', () => {
		expect(logPolar([], 300).rings).toEqual([0, 1]);
	});
});
