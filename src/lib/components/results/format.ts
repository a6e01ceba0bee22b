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

/** A signed fraction as a percentage ("+1.8 %", "−1.96 %"); an exact 0 has no sign ("0 %"). */
export const signedPct = (v: number, digits = 3) =>
	`${v > 0 ? '+' : v < 0 ? '−' : ''}${pct(Math.abs(v), digits)}`;

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

/** How an estimate was made, in words a designer reads beside the number. */
export function estimateMethod(e: {
	method: string;
	basis: string;
	element: string | null;
}): string {
	switch (e.method) {
		case 'b1':
			return '1/b1, b1 = Σ τ open';
		case 'ratio':
			return `coefficient ratio ${e.basis}`;
		case 'two-pole':
			return 'root of 1 + b1·s + b2·s²';
		default:
			return `sequential, port ${e.element}`;
	}
}

/** The resistance a port sees, as one line: "Rtop ∥ (Rsrc + Radc) = 900 kΩ", or why there is no formula. */
export function formulaLine(f: {
	kind: string;
	formula: string | null;
	value: number | null;
	reason: string | null;
	influence: { element: string; sensitivity: number }[];
}): string {
	if (f.kind === 'series-parallel') return `${f.formula} = ${eng(f.value, 'Ω')}`;
	if (f.kind === 'open') return `∞ — ${f.reason}`;
	if (f.kind === 'short') return `0 Ω — ${f.reason}`;
	const most = f.influence.length
		? `; matters most: ${f.influence.map((x) => `${x.element} (S = ${Number(x.sensitivity.toPrecision(2))})`).join(', ')}`
		: '';
	return `not series–parallel (${f.reason}): ${eng(f.value, 'Ω')} from the solver${most}`;
}
