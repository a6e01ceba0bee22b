import { formatEngineering, parseValue } from '$lib/solver';

/** Units of each element type's value, for display and for reading typed values. */
export const UNIT: Record<string, string> = { R: 'Ω', C: 'F', L: 'H', VCCS: 'S', CCVS: 'Ω', VCVS: '', CCCS: '' };

export const show = (v: number | null | undefined, unit = '', digits = 4) => (v === null || v === undefined || Number.isNaN(v) ? '—' : formatEngineering(v, unit, digits));

/** A typed value ("6.8p", "1.5 MHz" → number) or null with the field named in the message. */
export function readNumber(text: string, field: string): { value: number } | { error: string } {
	const t = text.trim().replace(/\s*(Hz|s|dB|%)$/, '');
	try {
		return { value: parseValue(t) };
	} catch {
		return { error: `${field}: “${text}” is not a number (SI prefixes such as 10p, 4.7k, 1.5M are fine)` };
	}
}

export function valueOf(v: unknown): number {
	return typeof v === 'number' ? v : parseValue(String(v ?? ''));
}
