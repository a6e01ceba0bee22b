import { describe, expect, it } from 'vitest';
import { gainText, gainUnit } from './gain-text';

describe('gainText', () => {
	// 20·log10(0.1) = −20 dB and 20·log10(0.5) = −6.0206 dB (definition of the decibel for a
	// voltage ratio, common practice).
	it('writes a gain plain with its unit and dB, never with an SI prefix', () => {
		expect(gainText(0.0999995, 'V/V', 6)).toBe('0.0999995 V/V (−20.00 dB)');
		expect(gainText(0.5)).toBe('0.5 V/V (−6.02 dB)');
		expect(gainText(0.09837)).not.toMatch(/m V/);
		expect(gainText(-2, 'V/V')).toBe('−2 V/V (6.02 dB)');
		expect(gainText(1000, 'V/A')).toBe('1000 V/A (60.00 dB)');
	});
	it('a gain of one within round-off is 0.00 dB, not −0.00 dB', () => {
		expect(gainText(1 - 1e-12)).toBe('1 V/V (0.00 dB)');
		expect(gainText(0.9999)).toBe('0.9999 V/V (0.00 dB)');
		expect(gainText(0.999)).toBe('0.999 V/V (−0.01 dB)');
	});
	it('reads round-off of zero as ≈ 0 without a dB, and a missing gain as a dash', () => {
		expect(gainText(3e-17)).toBe('≈ 0 V/V');
		expect(gainText(null)).toBe('—');
		expect(gainText(Infinity)).toBe('—');
	});
	it('is V/A when a current source drives the network', () => {
		const els = [
			{ id: 'I1', type: 'I' },
			{ id: 'V1', type: 'V' }
		];
		expect(gainUnit({ input: 'I1', elements: els })).toBe('V/A');
		expect(gainUnit({ input: 'V1', elements: els })).toBe('V/V');
		expect(gainUnit({ input: null, elements: [] })).toBe('V/V');
	});
});
