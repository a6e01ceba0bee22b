import { describe, expect, it } from 'vitest';
import { pct } from './format';

describe('percentages in the result panels', () => {
	it('reads round-off as below the last shown digit, not in exponent notation', () => {
		expect(pct(4.6e-16)).toBe('< 0.0001 %');
		expect(pct(0)).toBe('0 %');
		expect(pct(0.59)).toBe('59 %');
		expect(pct(0.0123)).toBe('1.2 %');
		expect(pct(12)).toBe('1200 %');
		expect(pct(null)).toBe('—');
	});
});
