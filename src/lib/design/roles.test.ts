import { describe, expect, it } from 'vitest';
import { solveForValue } from './solve-for-value';
import { snappable, trimmerSetting } from './roles';
import { DesignError } from './errors';

// The 10:1 probe divider (common practice): flat when Rt·Ct = Rin·(Cin + Ccable), i.e.
// Ct = 1 MΩ · (18 pF + 42 pF) / 9 MΩ = 6.667 pF. Ccable is the cable: a fixed value.
const divider = (ct: Record<string, unknown> = {}) => ({
	schema: 1,
	elements: [
		{ id: 'V1', type: 'V', nodes: ['src', 'gnd'], value: 1 },
		{ id: 'Rs', type: 'R', nodes: ['src', 'a'], value: '50' },
		{ id: 'Rt', type: 'R', nodes: ['a', 'b'], value: '9M' },
		{ id: 'Ct', type: 'C', nodes: ['a', 'b'], value: '6.8p', ...ct },
		{ id: 'Rin', type: 'R', nodes: ['b', 'gnd'], value: '1M' },
		{ id: 'Cin', type: 'C', nodes: ['b', 'gnd'], value: '18p' },
		{ id: 'Ccable', type: 'C', nodes: ['b', 'gnd'], value: '42p', role: 'fixed' }
	],
	input: 'V1',
	output: { node: 'b' }
});

describe('part roles in the design aids', () => {
	it('snapping leaves fixed values and trimmers alone, and says so', () => {
		const doc = divider({ role: 'trimmer', range: { min: '2p', max: '10p' } });
		const { parts, skipped } = snappable(doc as never);
		expect(parts.map((p) => p.id)).toEqual(['Rs', 'Rt', 'Rin', 'Cin']);
		expect(skipped).toEqual([
			{ id: 'Ct', why: 'trimmer (set by adjustment)' },
			{ id: 'Ccable', why: 'fixed value' }
		]);
	});

	it('solving for a fixed value is refused naming the part', () => {
		expect(() =>
			solveForValue(divider(), { element: 'Ccable', goal: { kind: 'flat' } })
		).toThrowError(DesignError);
		try {
			solveForValue(divider(), { element: 'Ccable', goal: { kind: 'flat' } });
		} catch (e) {
			expect((e as DesignError).code).toBe('fixed_part');
			expect((e as DesignError).message).toMatch(/^"Ccable" is a fixed value/);
		}
	});

	it('solving for a trimmer answers with its setting within the range (no preferred values)', () => {
		const r = solveForValue(divider({ role: 'trimmer', range: { min: '2p', max: '10p' } }), {
			element: 'Ct',
			goal: { kind: 'flat' }
		});
		expect(r.value / 6.6667e-12).toBeCloseTo(1, 3);
		expect(r.preferred).toBeNull();
		expect(r.trimmer).toMatchObject({ inRange: true });
		// (6.667 − 2) / (10 − 2) = 58 % of the range.
		expect(r.trimmer!.position).toBeCloseTo(0.5833, 3);
	});

	it('a trimmer whose range cannot reach the answer is said to be out of range', () => {
		const r = solveForValue(
			divider({ role: 'trimmer', range: { min: '8p', max: '12p' }, value: '10p' }),
			{ element: 'Ct', goal: { kind: 'flat' } }
		);
		expect(r.value / 6.6667e-12).toBeCloseTo(1, 3);
		expect(r.trimmer).toMatchObject({ inRange: false, min: 8e-12, max: 12e-12 });
		expect(r.trimmer!.position).toBeLessThan(0);
	});

	it('a design value still gets its preferred neighbours', () => {
		const r = solveForValue(divider(), { element: 'Ct', goal: { kind: 'flat' } });
		expect(r.trimmer).toBeNull();
		expect(r.preferred).not.toBeNull();
	});

	it('trimmerSetting is null for parts without a trimmer range', () => {
		expect(trimmerSetting({ id: 'R', type: 'R', nodes: ['a', 'b'], value: 1 }, 1)).toBeNull();
	});
});
