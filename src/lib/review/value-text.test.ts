import { describe, expect, it } from 'vitest';
import { valueText } from './value-text';

describe('valueText', () => {
	it.each([
		['C', '6.8p', '6.8 pF'],
		['R', '50', '50 Ω'],
		['R', '2k2', '2.2 kΩ'],
		['R', 9e6, '9 MΩ'],
		['L', '1.5µ', '1.5 µH'],
		['VCCS', '40m', '40 mS'],
		['VCVS', '100k', '100000 V/V'],
		['CCCS', '-0.5', '-0.5 A/A'],
		['V', 1, '1 V']
	])('%s %s → %s', (type, raw, want) => expect(valueText(type, raw)).toBe(want));
	it('a value the parser refuses stays as typed; a missing one is a dash', () => {
		expect(valueText('C', '10pp')).toBe('10pp');
		expect(valueText('C', null)).toBe('—');
	});
});
