import { SolverError } from './errors';

/** SI prefixes accepted in values. Case matters: `m` is milli and `M` is mega. */
const PREFIX: Record<string, number> = {
	y: 1e-24,
	z: 1e-21,
	a: 1e-18,
	f: 1e-15,
	p: 1e-12,
	n: 1e-9,
	u: 1e-6,
	µ: 1e-6, // U+00B5 micro sign, what most keyboards produce
	μ: 1e-6, // U+03BC Greek mu, what some fonts and pastes produce
	m: 1e-3,
	k: 1e3,
	M: 1e6,
	G: 1e9,
	T: 1e12
};

/** Units accepted after the prefix; they are informative only (the element type fixes the unit). */
const UNITS = ['ohms', 'ohm', 'Ω', 'Ohm', 'Ohms', 'F', 'H', 'V', 'A', 'S'];

const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?/;

/**
 * The letter-and-numeral code of IEC 60062 (and the trade's habit): the multiplier letter stands
 * where the decimal point would be — `2k2` = 2.2 k, `4n7` = 4.7 n, `R47` = 0.47, `4R7` = 4.7,
 * `p68` = 0.68 p, `1K0` = 1.0 k, `47R` = 47. The standard writes R, K, M, G, T for resistance and p, n, µ, m,
 * F for capacitance; lower-case k is common practice. R (ohms) and K (kilo) are read only where
 * the unit may be ohms, F only where it may be farads.
 */
const LETTER_CODE = /^([+-]?)(\d*)([yzafpnuµμmkKMGTRF])(\d*)(?![\d.eE])/;

function codeScale(letter: string, unit?: string): number | null {
	const ohms = unit === undefined || sameUnit(unit, 'Ω');
	if (letter === 'R') return ohms ? 1 : null;
	if (letter === 'K') return ohms ? 1e3 : null;
	if (letter === 'F') return unit === undefined || unit === 'F' ? 1 : null;
	return PREFIX[letter] ?? null;
}

/** The smallest normal double; below it a value has lost digits (and below ~4.9e-324 it is 0). */
const SMALLEST_NORMAL = 2.2250738585072014e-308;

/**
 * Reads a value typed by a person: `"4.7k"`, `"10p"`, `"9MΩ"`, `"2.2µF"`, `"1e-12"`, or a number.
 * Throws `SolverError` with a short reason; `validate.ts` rethrows it naming the element.
 * When `unit` is given, only that unit (or none) may follow the prefix.
 */
export function parseValue(text: string | number, unit?: string): number {
	if (typeof text === 'number') {
		if (!Number.isFinite(text)) throw new SolverError('non_finite', `value ${text} is not finite`);
		return text;
	}
	const s = text.trim();
	const code = LETTER_CODE.exec(s);
	const codeMul = code ? codeScale(code[3], unit) : null;
	if (code && codeMul !== null && (code[2] || code[4])) {
		const [whole, sign, before, , after] = code;
		const rest = s.slice(whole.length).trim();
		if (rest && !isUnit(rest, unit)) throw notANumber(text);
		return checked(text, Number(`${sign}${before || '0'}.${after}`) * codeMul, after);
	}
	const m = NUMBER.exec(s);
	if (!m) throw notANumber(text);
	let rest = s.slice(m[0].length).trim();
	let scale = 1;
	// No unit starts with a prefix letter (case matters: "A" is ampere, "a" atto), so a leading
	// prefix letter is always a prefix unless the whole rest is a unit. A space may stand
	// between the number, the prefix and the unit ("10 pF", "1k ohm").
	const first = rest.charAt(0);
	if (first && first in PREFIX && !isUnit(rest, unit)) {
		scale = PREFIX[first];
		rest = rest.slice(first.length).trim();
	}
	if (rest && !isUnit(rest, unit)) throw notANumber(text);
	return checked(text, Number(m[0]) * scale, m[0]);
}

const notANumber = (text: string) =>
	new SolverError('bad_value', `value "${text}" is not a number with an SI prefix`);

/** Overflow and underflow are said as such: "1e-400" is not zero, it is too small to hold. */
function checked(text: string, v: number, digits: string): number {
	if (!Number.isFinite(v)) {
		throw new SolverError(
			'non_finite',
			`value "${text}" is not finite: it overflows (the largest number is about 1.8e308)`
		);
	}
	const mantissaIsZero = !/[1-9]/.test(digits.replace(/[eE].*$/, ''));
	if (!mantissaIsZero && Math.abs(v) < SMALLEST_NORMAL) {
		throw new SolverError(
			'underflow',
			`value "${text}" underflows: it is smaller than the smallest number held exactly (about 2.2e-308)`
		);
	}
	return v;
}

function isUnit(rest: string, unit?: string): boolean {
	const allowed = unit ? UNITS.filter((u) => sameUnit(u, unit)) : UNITS;
	return allowed.includes(rest);
}

function sameUnit(a: string, b: string): boolean {
	const ohm = (u: string) => (['ohms', 'ohm', 'Ohm', 'Ω'].includes(u) ? 'Ω' : u);
	return ohm(a) === ohm(b);
}
