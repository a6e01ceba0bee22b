// Number formatting for the result panels: engineering notation from the solver's formatter,
// with a dash where a value does not exist (infinite resistance, no Q for a real pole).
import { formatEngineering } from '$lib/solver/notation';

export const eng = (v: number | null | undefined, unit = '', digits = 4) =>
	v === null || v === undefined || !Number.isFinite(v)
		? v === Infinity
			? '∞'
			: '—'
		: formatEngineering(v, unit, digits);

/** A fraction as a percentage; below 0.0001 % (round-off, e.g. an exact one-pole estimate) it
 *  reads "< 0.0001 %" rather than "4.6e-14 %". */
export const pct = (v: number | null | undefined, digits = 2) =>
	v === null || v === undefined || !Number.isFinite(v)
		? '—'
		: v === 0
			? '0 %'
			: Math.abs(v) < 1e-6
				? '< 0.0001 %'
				: v >= 10
					? `${Math.round(v * 100)} %`
					: `${Number((v * 100).toPrecision(digits))} %`;

/** A complex frequency in rad/s as "−1.11 k ± j 2.2 M". */
export function sValue(re: number, im: number): string {
	const r = formatEngineering(re, '', 5);
	if (Math.abs(im) < 1e-12 * Math.max(1, Math.abs(re))) return r;
	return `${r} ± j${formatEngineering(Math.abs(im), '', 5)}`;
}

/** A plain number; values below 1e-9 of unity read as ≈ 0 (round-off of an exact zero). */
export const plain = (v: number | null | undefined, digits = 4) =>
	v === null || v === undefined || !Number.isFinite(v)
		? '—'
		: Math.abs(v) < 1e-9
			? '≈ 0'
			: Number(v.toPrecision(digits)).toString();
