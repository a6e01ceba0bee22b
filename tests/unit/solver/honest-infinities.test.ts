import { describe, expect, test } from 'vitest';
import { analyze } from '../../../src/lib/solver/index';
import { el, expectRel, net } from './helpers';

/**
 * What is infinite or undefined is null, never a huge finite stand-in (issue 12, item 6).
 * References: closed forms (an LC tank resonates at 1/√(LC), common practice) and the structure.
 */
describe('honest infinities', () => {
	const tank = net(
		[
			el('Iin', 'I', ['a', 'gnd'], 1),
			el('L1', 'L', ['a', 'b'], '1u'),
			el('C1', 'C', ['b', 'gnd'], '1n'),
			el('C2', 'C', ['a', 'gnd'], '1n')
		],
		'b',
		'Iin'
	);
	const a = analyze(tank);
	test('a lossless LC network: poles exactly on the jω axis, Q and τ null, no unstable warning', () => {
		const ringing = a.poles.filter((p) => p.im !== 0);
		expect(ringing).toHaveLength(2);
		for (const p of ringing) {
			expect(p.re).toBe(0);
			expect(p.q).toBeNull();
			expect(p.tau).toBeNull();
			// Closed form: C1 and C2 in series with L: ω² = (C1 + C2)/(L·C1·C2) = 2/(L·C).
			expectRel(Math.abs(p.im), Math.sqrt(2 / (1e-6 * 1e-9)), 1e-12, '|ω|');
		}
		expect(a.warnings.map((w) => w.code)).not.toContain('unstable');
	});
	test('a current input into capacitors only: DC input impedance null, DC gain null (pole at 0)', () => {
		expect(a.inputImpedance!.dc).toBeNull();
		expect(a.dcGain).toBeNull();
	});
	test('H(∞) is exactly 0 for a strictly proper transfer (relative degree 3 here)', () => {
		expect(a.highFrequencyGain).toBe(0);
	});
	test('a V input feeding only a series R–C to ground: DC input impedance null (no DC current)', () => {
		const b = analyze(
			net(
				[
					el('Vin', 'V', ['in', 'gnd'], 1),
					el('R1', 'R', ['in', 'o'], '1k'),
					el('C1', 'C', ['o', 'gnd'], '1n')
				],
				'o'
			)
		);
		expect(b.inputImpedance!.dc).toBeNull();
		expect(b.dcGain).toBe(1);
	});
	test('a transfer that grows with frequency: H(∞) null (a differentiator built around an ideal op-amp)', () => {
		const c = analyze(
			net(
				[
					el('Vin', 'V', ['in', 'gnd'], 1),
					el('C1', 'C', ['in', 'm'], '1n'),
					el('R1', 'R', ['m', 'o'], '10k'),
					el('U1', 'OPAMP', ['gnd', 'm', 'o'])
				],
				'o'
			)
		);
		expect(c.highFrequencyGain).toBeNull();
		expect(c.zeros.map((z) => z.hz)).toEqual([0]);
	});
	test('no field of any analysis above holds a non-finite number or a finite value above 1e300', () => {
		const walk = (x: unknown, path: string) => {
			if (typeof x === 'number') {
				expect(Number.isFinite(x), path).toBe(true);
				expect(Math.abs(x) < 1e300, path).toBe(true);
			} else if (Array.isArray(x)) x.forEach((v, i) => walk(v, `${path}[${i}]`));
			else if (x && typeof x === 'object')
				for (const [k, v] of Object.entries(x)) walk(v, `${path}.${k}`);
		};
		walk(a, 'analysis');
	});
});
