import { describe, expect, it } from 'vitest';
import { checkValue } from './values';

describe('checkValue (what the properties panel and the symbol say)', () => {
	it('a negative resistor is accepted with a warning', () => {
		const c = checkValue('R', '-1k');
		expect(c).toMatchObject({ ok: true, value: -1000, normal: '-1 kΩ' });
		expect(c.ok && c.warning).toMatch(/^a negative resistor/);
	});
	it('a negative controlled-source gain is normal and carries no warning', () => {
		const c = checkValue('VCVS', '-10');
		expect(c.ok && c.warning).toBeFalsy();
	});
	it('"1e-400" is said to underflow, not to be zero', () => {
		const c = checkValue('C', '1e-400');
		expect(c.ok).toBe(false);
		expect(!c.ok && c.message).toMatch(/underflows/);
		expect(!c.ok && c.message).not.toMatch(/0 is not allowed|SI prefix/);
	});
	it('the trade notation is read: 2k2, 4n7, "1k ohm", "10 pF"', () => {
		expect(checkValue('R', '2k2')).toMatchObject({ ok: true, normal: '2.2 kΩ' });
		expect(checkValue('C', '4n7')).toMatchObject({ ok: true, normal: '4.7 nF' });
		expect(checkValue('R', '1k ohm')).toMatchObject({ ok: true, normal: '1 kΩ' });
		expect(checkValue('C', '10 pF')).toMatchObject({ ok: true, normal: '10 pF' });
	});
});
