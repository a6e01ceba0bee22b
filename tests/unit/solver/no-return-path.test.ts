import { describe, expect, test } from 'vitest';
import { analyze } from '../../../src/lib/solver/index';
import { el, net } from './build';
import { randomNetwork } from './random-networks';

/**
 * An inductor whose only way back at DC is through itself: in the open-circuit configuration
 * (capacitors open, other inductors shorted) it sees an infinite resistance, so its time
 * constant L/R is exactly 0 (common practice: a series L–C branch to ground). The dense path
 * read the round-off of its solve instead (−1.4e17 Ω, τ = −3.6e-23 s, on a random 683-element
 * RLC network where the sparse path said 0).
 */
describe('a voltage port with no DC return path', () => {
	test('an inductor in series with a capacitor to ground: R seen infinite (null), τ open exactly 0', () => {
		const doc = net(
			[
				el('Vin', 'V', ['in', 'gnd'], 1),
				el('R1', 'R', ['in', 'a'], 1e3),
				el('R2', 'R', ['a', 'gnd'], 2.2e3),
				el('L1', 'L', ['a', 'b'], 1e-6),
				el('C1', 'C', ['b', 'gnd'], 1e-9),
				el('C2', 'C', ['a', 'gnd'], 1e-12)
			],
			'a'
		);
		for (const backend of ['dense', 'sparse'] as const) {
			const a = analyze(doc, { backend, frequency: false, step: false } as never);
			const open = (a.timeConstants as unknown as { openCircuit: { element: string; resistance: number | null; tau: number | null }[] }).openCircuit;
			const l1 = open.find((p) => p.element === 'L1')!;
			expect(l1.tau, backend).toBe(0);
			expect(l1.resistance, backend).toBeNull();
			// The capacitor beside it still sees R1 ∥ R2 (the inductor shorted joins nothing new).
			const c2 = open.find((p) => p.element === 'C2')!;
			expect(Math.abs(c2.resistance! - (1e3 * 2.2e3) / 3.2e3) / 687.5, backend).toBeLessThan(1e-12);
		}
	});

	test('the random RLC network where the dense path read round-off: L626 exactly 0, both back ends', () => {
		const doc = randomNetwork('rlc', 683, 1098);
		for (const backend of ['dense', 'sparse'] as const) {
			const a = analyze(doc, { backend, frequency: false, step: false } as never);
			const open = (a.timeConstants as unknown as { openCircuit: { element: string; resistance: number | null; tau: number | null }[] }).openCircuit;
			const l = open.find((p) => p.element === 'L626')!;
			expect(l.tau, backend).toBe(0);
			expect(l.resistance, backend).toBeNull();
		}
	});
});
