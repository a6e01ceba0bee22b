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

// IEC 60062:2016 (Marking codes for resistors and capacitors), clause 5, the letter and numeral
// code: the multiplier letter stands in place of the decimal point; R, K, M, G, T for
// resistance, p, n, µ, m, F for capacitance. Examples as in the standard's tables (from memory:
// R47, 4R7, 4K7, 1M0, p68, 4n7, 3µ3, 6F8); lower-case k in `2k2` is common practice.
const LETTER_CODE: [string, string | undefined, number][] = [
	['R47', 'Ω', 0.47],
	['4R7', 'Ω', 4.7],
	['47R', 'Ω', 47],
	['4K7', 'Ω', 4.7e3],
	['2k2', 'Ω', 2.2e3],
	['1M0', 'Ω', 1e6],
	['2G2', 'Ω', 2.2e9],
	['1T5', 'Ω', 1.5e12],
	['p68', 'F', 0.68e-12],
	['4n7', 'F', 4.7e-9],
	['3µ3', 'F', 3.3e-6],
	['3u3', 'F', 3.3e-6],
	['1m5', 'F', 1.5e-3],
	['6F8', 'F', 6.8],
	['2k2Ω', 'Ω', 2.2e3],
	['4n7 F', 'F', 4.7e-9],
	['2k2 ohm', 'Ω', 2.2e3],
	['-4k7', 'Ω', -4.7e3],
	['4n7', undefined, 4.7e-9]
];
// A unit word after a space: "1k ohm", "10 pF" (common practice in parts lists).
const SPACED: [string, string | undefined, number][] = [
	['1k ohm', 'Ω', 1e3],
	['1k ohms', 'Ω', 1e3],
	['1 kΩ', 'Ω', 1e3],
	['10 pF', 'F', 10e-12],
	['10 p F', 'F', 10e-12],
	['2.2 µF', 'F', 2.2e-6],
	['4.7 k', undefined, 4.7e3],
	['100 ohm', 'Ω', 100]
];

describe('parseValue: letter and numeral code (IEC 60062) and spaced units (relative error 1e-15)', () => {
	for (const [text, unit, want] of [...LETTER_CODE, ...SPACED]) {
		test(`${JSON.stringify(text)}${unit ? ` as ${unit}` : ''} → ${want}`, () => {
			const got = parseValue(text, unit);
			expect(Math.abs(got - want) / Math.abs(want)).toBeLessThanOrEqual(1e-15);
		});
	}
	// The code's R, K and F belong to their own units; a second decimal point or an exponent
	// after the code is not a code.
	for (const [bad, unit] of [
		['4R7', 'F'],
		['4K7', 'F'],
		['6F8', 'H'],
		['2k2.5', 'Ω'],
		['2k2e3', 'Ω'],
		['4n7 H', 'F'],
		['1k oh', 'Ω']
	] as const) {
		test(`"${bad}" as ${unit} is refused with bad_value`, () => {
			expect(() => parseValue(bad, unit)).toThrowError(/is not a number with an SI prefix/);
		});
	}
});

describe('parseValue: overflow and underflow are said as such', () => {
	test('"1e-400" underflows (it is not zero)', () => {
		try {
			parseValue('1e-400', 'F');
			throw new Error('accepted');
		} catch (e) {
			expect((e as SolverError).code).toBe('underflow');
			expect((e as SolverError).message).toMatch(/^value "1e-400" underflows/);
		}
	});
	test('a subnormal value underflows too; zero written as 0e-400 stays zero', () => {
		expect(() => parseValue('1e-310')).toThrowError(/underflows/);
		expect(() => parseValue('0.001y')).not.toThrow();
		expect(parseValue('0e-400')).toBe(0);
	});
	test('"1e999" overflows', () => {
		expect(() => parseValue('1e999')).toThrowError(/overflows/);
	});
});
