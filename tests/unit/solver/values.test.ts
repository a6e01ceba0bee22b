import { describe, expect, test } from 'vitest';
import { formatEngineering, parseValue, SolverError } from '../../../src/lib/solver/index';

// Source: the SI prefix definitions (BIPM SI Brochure); case matters: m milli, M mega.
const PARSE: [string | number, string | undefined, number][] = [
	['10p', undefined, 10e-12],
	['4.7k', undefined, 4.7e3],
	['9MΩ', 'Ω', 9e6],
	['9Mohm', 'Ω', 9e6],
	['2.2µF', 'F', 2.2e-6],
	['2.2μF', 'F', 2.2e-6],
	['2.2uF', 'F', 2.2e-6],
	['1m', undefined, 1e-3],
	['1M', undefined, 1e6],
	['1e-12', undefined, 1e-12],
	[' 33n ', undefined, 33e-9],
	['-10k', undefined, -10e3],
	['.5', undefined, 0.5],
	['1F', 'F', 1],
	['1A', 'A', 1],
	['1a', undefined, 1e-18],
	['3T', undefined, 3e12],
	[47, undefined, 47]
];

describe('parseValue (relative error 1e-15)', () => {
	for (const [text, unit, want] of PARSE) {
		test(`${JSON.stringify(text)}${unit ? ` as ${unit}` : ''} → ${want}`, () => {
			const got = parseValue(text, unit);
			expect(Math.abs(got - want) / Math.abs(want)).toBeLessThanOrEqual(1e-15);
		});
	}
	for (const bad of ['10pp', 'k', '', '1 0', '10pH', '1e', 'ten']) {
		test(`"${bad}" as F is refused with bad_value`, () => {
			expect(() => parseValue(bad, 'F')).toThrowError(SolverError);
			try {
				parseValue(bad, 'F');
			} catch (e) {
				expect((e as SolverError).code).toBe('bad_value');
			}
		});
	}
	test('overflow is non_finite', () => {
		expect(() => parseValue('1e999')).toThrowError(/not finite/);
	});
});

describe('formatEngineering', () => {
	const CASES: [number, string | undefined, number | undefined, string][] = [
		[9.1e6, 'Ω', undefined, '9.1 MΩ'],
		[1768.388, 'Hz', undefined, '1.768 kHz'],
		[4.7e-12, 'F', undefined, '4.7 pF'],
		[999.96, 'Ω', 4, '1 kΩ'],
		[0.001, 's', undefined, '1 ms'],
		[-2.2e-6, 'A', undefined, '-2.2 µA'],
		[0, 'V', undefined, '0 V'],
		[Infinity, undefined, undefined, '∞'],
		[123456, '', 3, '123k']
	];
	for (const [v, unit, digits, want] of CASES) {
		test(`${v} → "${want}"`, () => expect(formatEngineering(v, unit, digits)).toBe(want));
	}
	test('round trip: parse(format(x)) within the printed digits (1e-3)', () => {
		for (const x of [3.3e-9, 47e3, 1.5e-6, 2.7e12]) {
			const s = formatEngineering(x, '', 4);
			expect(Math.abs(parseValue(s) - x) / x).toBeLessThan(1e-3);
		}
	});
});
