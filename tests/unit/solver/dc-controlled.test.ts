import { describe, expect, test } from 'vitest';
import { analyze } from '../../../src/lib/solver/index';
import { el, expectRel, net } from './helpers';

/**
 * Controlled sources in the open- and short-circuit configurations of the time constants: one
 * whose control is its own branch or terminals is the resistance it represents; one whose ideal
 * output the configuration shorts makes that configuration inconsistent (null + warning).
 * References are closed forms: series/parallel resistances of the same network with the
 * controlled source replaced by the resistor it represents.
 */
const base = (middle: ReturnType<typeof el>[]) =>
	net(
		[
			el('Vin', 'V', ['in', 'gnd'], 1),
			el('R1', 'R', ['in', 'a'], 375),
			el('C1', 'C', ['a', 'gnd'], '1n'),
			...middle,
			el('C2', 'C', ['c', 'gnd'], '2n'),
			el('R2', 'R', ['c', 'gnd'], 1000)
		],
		'c'
	);

const par = (a: number, b: number) => (a * b) / (a + b);

describe('a controlled source as the resistance it represents', () => {
	// Closed form, short-circuit configuration: C1 sees R1 ∥ 30 Ω (C2 shorted) = 27.78 Ω;
	// C2 sees R2 ∥ 30 Ω (C1 shorted puts the 30 Ω to ground).
	const expectSc = (doc: unknown, what: string) => {
		const a = analyze(doc, { frequency: false, step: false });
		const [c1, c2] = a.timeConstants.shortCircuit;
		expectRel(c1.resistance, par(375, 30), 1e-12, `${what}: C1 short-circuit R (375 Ω ∥ 30 Ω)`);
		expectRel(c2.resistance, par(1000, 30), 1e-12, `${what}: C2 short-circuit R (1 kΩ ∥ 30 Ω)`);
		// Open-circuit: C1 sees 375 ∥ (30 + 1000); C2 sees 1000 ∥ (30 + 375).
		const [o1, o2] = a.timeConstants.openCircuit;
		expectRel(o1.resistance, par(375, 1030), 1e-12, `${what}: C1 open-circuit R`);
		expectRel(o2.resistance, par(1000, 405), 1e-12, `${what}: C2 open-circuit R`);
		expect(a.warnings.map((w) => w.code)).not.toContain('inconsistent_configuration');
	};
	test('issue 12 example 4: CCVS whose voltage is −30 Ω × its own (reversed-sensor) branch current', () => {
		expectSc(base([el('H1', 'CCVS', ['a', 'b'], -30, 'Vs'), el('Vs', 'V', ['c', 'b'], 0)]), 'CCVS');
	});
	test('the same CCVS with the sensor the other way round and +30 Ω', () => {
		expectSc(base([el('H1', 'CCVS', ['a', 'b'], 30, 'Vs'), el('Vs', 'V', ['b', 'c'], 0)]), 'CCVS+');
	});
	test('a VCCS whose control is its own terminals: a conductance of 1/30 S', () => {
		const doc = base([{ ...el('G1', 'VCCS', ['a', 'c', 'a', 'c'], 1 / 30) }]);
		expectSc(doc, 'VCCS');
	});
	test('reference: the real 30 Ω resistor', () => {
		expectSc(base([el('R3', 'R', ['a', 'c'], 30)]), 'R');
	});
});

describe('an ideal output shorted by the configuration', () => {
	// A follower driving a load capacitor: with every capacitor shorted, CL shorts the op-amp's
	// output. CL itself sees 0 Ω (an ideal output); C1's reading needs CL shorted: inconsistent.
	const doc = net(
		[
			el('Vin', 'V', ['in', 'gnd'], 1),
			el('R1', 'R', ['in', 'p'], 1000),
			el('C1', 'C', ['p', 'gnd'], '1n'),
			el('U1', 'OPAMP', ['p', 'out', 'out']),
			el('CL', 'C', ['out', 'gnd'], '1n')
		],
		'out'
	);
	test('null with a warning naming the op-amp and the capacitor', () => {
		const a = analyze(doc, { frequency: false, step: false });
		const [c1, cl] = a.timeConstants.shortCircuit;
		expect(c1).toMatchObject({ element: 'C1', resistance: null, tau: null });
		expect(cl).toMatchObject({ element: 'CL', resistance: 0, tau: 0 });
		const w = a.warnings.find((x) => x.code === 'inconsistent_configuration');
		expect(w?.element).toBe('U1');
		expect(w?.message).toContain('CL');
		// The open-circuit configuration is consistent: C1 sees R1 (closed form), CL 0 Ω.
		expect(a.timeConstants.openCircuit[0].resistance).toBeCloseTo(1000, 9);
		expect(a.timeConstants.openCircuit[1].resistance).toBe(0);
	});
});
