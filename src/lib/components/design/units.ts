import { formatEngineering, parseValue } from '$lib/solver/notation';

/** Units of each element type's value, for display and for reading typed values. */
export const UNIT: Record<string, string> = {
	R: 'Ω',
	C: 'F',
	L: 'H',
	VCCS: 'S',
	CCVS: 'Ω',
	VCVS: '',
	CCCS: ''
};

export const show = (v: number | null | undefined, unit = '', digits = 4) =>
	v === null || v === undefined || Number.isNaN(v) ? '—' : formatEngineering(v, unit, digits);

/** A typed value ("6.8p", "1.5 MHz" → number) or null with the field named in the message. */
export function readNumber(text: string, field: string): { value: number } | { error: string } {
	const t = text.trim().replace(/\s*(Hz|s|dB|%)$/, '');
	try {
		return { value: parseValue(t) };
	} catch {
		return {
			error: `${field}: “${text}” is not a number (SI prefixes such as 10p, 4.7k, 1.5M are fine)`
		};
	}
}

export function valueOf(v: unknown): number {
	return typeof v === 'number' ? v : parseValue(String(v ?? ''));
}

/** Decibels as a designer reads them: 0.155 dB, 5.4e-5 dB (never "155 mdB"). */
export const db = (v: number | null | undefined) =>
	v === null || v === undefined || Number.isNaN(v)
		? '—'
		: `${Math.abs(v) < 1e-3 && v !== 0 ? v.toExponential(1) : v.toFixed(3)} dB`;

/** A relative change in percent, without a "−0.00". */
export const percentChange = (from: number | null | undefined, to: number | null | undefined) => {
	if (!from || !to) return '—';
	const p = (to / from - 1) * 100;
	return `${Math.abs(p) < 0.005 ? '0.00' : p.toFixed(2)} %`;
};

/** `show`, but decibels in plain dB. */
export const withUnit = (v: number | null | undefined, unit: string, digits = 4) =>
	unit === 'dB' ? db(v) : show(v, unit, digits);
