// A transfer function's gain as a reader expects it: a plain number with its unit (V/V, or V/A
// when a current source drives the network) and its dB — never SI prefixes ("98.37m" is not how
// a gain is read). Shared by the results, the report and the revision comparison.
import { plain } from '../components/results/format';

type Doc = { input?: string | null; elements: { id: string; type: string }[] };

/** The unit of H(s): the output is a voltage; the input a voltage or a current. */
export const gainUnit = (doc: Doc): 'V/V' | 'V/A' =>
	doc.elements.find((e) => e.id === doc.input)?.type === 'I' ? 'V/A' : 'V/V';

/** 20·log10|v| to 0.01 dB; a gain of 1 within round-off reads "0.00 dB", never "−0.00 dB". */
export function decibels(v: number): string {
	const db = 20 * Math.log10(Math.abs(v));
	return (Math.abs(db) < 0.005 ? 0 : db).toFixed(2).replace(/^-/, '−');
}

/** "0.1 V/V (−20.00 dB)"; "≈ 0 V/V" below 1e-9 (round-off of an exact zero, no dB of it). */
export function gainText(v: number | null | undefined, unit = 'V/V', digits = 4): string {
	if (v === null || v === undefined || !Number.isFinite(v)) return '—';
	const text = plain(v, digits).replace(/^-/, '−');
	return Math.abs(v) < 1e-9 ? `${text} ${unit}` : `${text} ${unit} (${decibels(v)} dB)`;
}
