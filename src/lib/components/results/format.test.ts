import { describe, expect, it } from 'vitest';
import { estimateMethod, formulaLine, pct, signedPct } from './format';

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

describe('how a resistance seen and an estimate are told', () => {
	it('a series–parallel formula with its value; otherwise the reason and what matters most', () => {
		const base = { reason: null, influence: [] };
		expect(
			formulaLine({
				...base,
				kind: 'series-parallel',
				formula: 'Rtop ∥ (Rsrc + Radc)',
				value: 900040.5
			})
		).toBe('Rtop ∥ (Rsrc + Radc) = 900 kΩ');
		expect(
			formulaLine({ ...base, kind: 'open', formula: null, value: null, reason: 'no DC path' })
		).toBe('∞ — no DC path');
		expect(
			formulaLine({
				kind: 'not-series-parallel',
				formula: null,
				value: 1234,
				reason: 'a bridge',
				influence: [{ element: 'R5', sensitivity: 0.4213 }]
			})
		).toBe('not series–parallel (a bridge): 1.234 kΩ from the solver; matters most: R5 (S = 0.42)');
	});
	it('each estimate names its method', () => {
		const e = (method: string, basis = '', element: string | null = null) =>
			estimateMethod({ method, basis, element });
		expect(e('b1')).toBe('1/b1, b1 = Σ τ open');
		expect(e('ratio', 'b2/b3')).toBe('coefficient ratio b2/b3');
		expect(e('two-pole')).toBe('root of 1 + b1·s + b2·s²');
		expect(e('sequential', 'port C1', 'C1')).toBe('sequential, port C1');
	});
});

describe('signedPct', () => {
	it('signs a doublet’s separation and tail, and leaves an exact 0 unsigned', () => {
		expect(signedPct(0.018)).toBe('+1.8 %');
		expect(signedPct(-0.0196)).toBe('−1.96 %');
		// A perfectly compensated divider: the pair cancels, no "−0 %".
		expect(signedPct(0)).toBe('0 %');
	});
});
