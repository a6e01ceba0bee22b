import { describe, expect, it } from 'vitest';
import { figureChange, zeroFloor } from './figure-change';

describe('figureChange', () => {
	it('a change between two clear values is relative (and carries the absolute one)', () => {
		expect(figureChange(159154.9, 79577.45, 0)).toEqual({
			kind: 'relative',
			pct: -50,
			absolute: -79577.45
		});
	});
	it('"≈ 0 → ≈ 0" (round-off on both sides) is no change, not −817 %', () => {
		// The case the issue saw: a DC gain of a high-pass, 1.1e-17 one side, −8e-17 the other.
		expect(figureChange(1.1e-17, -7.9e-17, zeroFloor(''))).toEqual({ kind: 'same' });
	});
	it('a settling time that goes to 0 is an absolute change, not −100 %', () => {
		expect(figureChange(4.6e-6, 0, zeroFloor('s'))).toEqual({
			kind: 'absolute',
			absolute: -4.6e-6
		});
	});
	it('from zero, or across zero, the change is absolute', () => {
		expect(figureChange(0, 0.5, zeroFloor(''))).toEqual({ kind: 'absolute', absolute: 0.5 });
		expect(figureChange(-0.1, 0.1, zeroFloor(''))).toMatchObject({ kind: 'absolute' });
	});
	it('a figure on one side only appears or disappears', () => {
		expect(figureChange(null, 1e6)).toEqual({ kind: 'appears' });
		expect(figureChange(2.5, null)).toEqual({ kind: 'disappears' });
		expect(figureChange(null, null)).toEqual({ kind: 'none' });
	});
	it('equal values, and values equal but for round-off, are the same', () => {
		expect(figureChange(3, 3)).toEqual({ kind: 'same' });
		expect(figureChange(1, 1 + 4.996e-15)).toEqual({ kind: 'same' });
	});
});
