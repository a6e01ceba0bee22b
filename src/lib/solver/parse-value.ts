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
const UNITS = ['ohms', 'ohm', 'Ω', 'Ohm', 'F', 'H', 'V', 'A', 'S'];

const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?/;

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
	const m = NUMBER.exec(s);
	if (!m) throw new SolverError('bad_value', `value "${text}" is not a number with an SI prefix`);
	let rest = s.slice(m[0].length).trim();
	let scale = 1;
	// No unit starts with a prefix letter (case matters: "A" is ampere, "a" atto), so a leading
	// prefix letter is always a prefix unless the whole rest is a unit.
	const first = rest.charAt(0);
	if (first && first in PREFIX && !isUnit(rest, unit)) {
		scale = PREFIX[first];
		rest = rest.slice(first.length);
	}
	if (rest && !isUnit(rest, unit)) {
		throw new SolverError('bad_value', `value "${text}" is not a number with an SI prefix`);
	}
	const v = Number(m[0]) * scale;
	if (!Number.isFinite(v)) throw new SolverError('non_finite', `value "${text}" is not finite`);
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
