// Reading values exactly as the network format does (the solver's own parser), and showing
// them back in normal form so a person can see what was understood: "9.1M" → "9.1 MΩ".
import { formatEngineering, parseValue, SolverError } from '$lib/solver/notation';
import { KINDS, type ItemKind } from './kinds';

/**
 * `warning`: accepted, but probably not meant — a negative R, C or L is analysed (active models
 * use them) yet a designer who typed `-1k` for a resistor should see it on the symbol and here.
 */
export type ValueCheck =
	{ ok: true; value: number; normal: string; warning?: string } | { ok: false; message: string };

export function checkValue(kind: ItemKind, text: string): ValueCheck {
	const info = KINDS[kind];
	if (!text.trim()) return { ok: false, message: `${info.valueLabel ?? 'Value'} is empty` };
	try {
		const value = parseValue(text, info.unit);
		if (value === 0 && (kind === 'R' || kind === 'C' || kind === 'L')) {
			return { ok: false, message: `a ${info.title.toLowerCase()} of 0 is not allowed` };
		}
		const normal = formatEngineering(value, info.unit ?? '', 6);
		if (value < 0 && (kind === 'R' || kind === 'C' || kind === 'L')) {
			const what = info.title.toLowerCase();
			return {
				ok: true,
				value,
				normal,
				warning: `a negative ${what}: analysed as typed (as in active models), not a part you can buy`
			};
		}
		return { ok: true, value, normal };
	} catch (error) {
		const reason = error instanceof Error ? error.message : String(error);
		// A value out of range needs no lesson in notation; a malformed one gets an example.
		if (error instanceof SolverError && error.code !== 'bad_value')
			return { ok: false, message: reason };
		const unit = info.unit ? ` and optionally ${info.unit}` : '';
		return {
			ok: false,
			message: `${reason}: use a number with an SI prefix${unit}, e.g. ${info.defaultValue}`
		};
	}
}

/** Tolerance as typed ("1%", "0.5 %", "0.01"); returns the fraction or an error message. */
export function checkTolerance(
	text: string
): { ok: true; value: number | null } | { ok: false; message: string } {
	const t = text.trim();
	if (!t) return { ok: true, value: null };
	const m = /^(\d+(?:\.\d*)?|\.\d+)\s*(%?)$/.exec(t);
	if (!m) return { ok: false, message: 'tolerance must look like 1% or 0.01' };
	const v = Number(m[1]) / (m[2] ? 100 : 1);
	if (v >= 1) return { ok: false, message: 'tolerance must be below 100 %' };
	return { ok: true, value: v };
}
