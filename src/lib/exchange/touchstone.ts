// Touchstone writer for two-ports, in the version 1.1 layout of the Touchstone File Format
// Specification (IBIS Open Forum), or in its version 2.0 layout (below). 1.1: comment lines
// start with "!", one option line "# <unit> <parameter> <format> R <n>" before the data, then
// one line per frequency holding the frequency and 8 numbers in the order the specification
// gives for 2-ports: N11 N21 N12 N22 (each as a pair: re/im for RI, magnitude/angle° for MA,
// dB/angle° for DB). Only ASCII is allowed in the file, so comments are transliterated. In
// version 1.x files Z- and Y-parameters are normalized to the reference resistance R (Z/R and
// Y·R); we follow that and say so in the file. Lines end in CR/LF, the line end the
// specification names.
//
// Version 2.0 (Touchstone File Format Specification Version 2.0, ratified by the IBIS Open Forum
// on April 24, 2009): "[Version] 2.0" is the first line that is not a comment, then the option
// line, "[Number of Ports] 2", "[Two-Port Data Order]", "[Number of Frequencies] n",
// "[Reference]" with one resistance per port, "[Network Data]", the data lines and "[End]". We
// write the order 21_12 (N11 N21 N12 N22, the order 1.x files use), so the data lines are the
// same as in a 1.1 file and a reader that ignores the keyword still reads them right. In 2.0
// files Z- and Y-parameters are not normalized: they are written in ohms and siemens.
import { FREQUENCY_UNITS, type FrequencyUnit } from './columns';
import { abs, type C, type M2 } from './complex2';

export type TouchstoneParameter = 'S' | 'Z' | 'Y';
export type TouchstoneFormat = 'RI' | 'MA' | 'DB';
export const TOUCHSTONE_VERSIONS = ['1.1', '2.0'] as const;
export type TouchstoneVersion = (typeof TOUCHSTONE_VERSIONS)[number];

export interface TouchstoneInput {
	parameter: TouchstoneParameter;
	format: TouchstoneFormat;
	unit: FrequencyUnit;
	z0: number;
	f: number[];
	/** Per frequency, the un-normalized 2×2 matrix (ohms for Z, siemens for Y). */
	values: M2[];
	comments: string[];
	/** Layout of the file; 1.1 unless asked. */
	version?: TouchstoneVersion;
}

const ASCII: Record<string, string> = {
	Ω: 'Ohm',
	µ: 'u',
	μ: 'u',
	'—': '-',
	'–': '-',
	'−': '-',
	'→': '->',
	'·': '.',
	'°': ' deg',
	'’': "'",
	'“': '"',
	'”': '"',
	'∥': '||'
};

/** Printable ASCII only (0x20–0x7E), as the specification requires. */
export function asciiComment(text: string): string {
	return text
		.replace(/[Ωµμ—–−→·°’“”∥]/g, (c) => ASCII[c])
		.normalize('NFKD')
		.replace(/[\u0300-\u036f]/g, '')
		.replace(/[^\x20-\x7e]/g, '?');
}

const num = (x: number) => x.toExponential(9);

function pair(c: C, format: TouchstoneFormat): string {
	if (format === 'RI') return `${num(c.re)} ${num(c.im)}`;
	const m = abs(c);
	const angle = m === 0 ? 0 : (Math.atan2(c.im, c.re) * 180) / Math.PI;
	// A magnitude of exactly 0 has no dB value; −400 dB stands for it (far below any noise floor).
	const first = format === 'MA' ? m : m === 0 ? -400 : 20 * Math.log10(m);
	return `${num(first)} ${num(angle)}`;
}

const frequencyText = (f: number, unit: FrequencyUnit) =>
	String(Number((f / FREQUENCY_UNITS[unit]).toPrecision(12)));
const resistanceText = (r: number) => String(Number(r.toPrecision(12)));

export function writeTouchstone(t: TouchstoneInput): string {
	const v2 = t.version === '2.0';
	const r = resistanceText(t.z0);
	// 1.x normalizes Z and Y to R; 2.0 keeps them in ohms and siemens.
	const norm = v2 ? 1 : t.parameter === 'Z' ? 1 / t.z0 : t.parameter === 'Y' ? t.z0 : 1;
	const lines = t.comments.map((c) => `! ${asciiComment(c)}`.trimEnd());
	if (t.parameter !== 'S')
		lines.push(
			v2
				? `! ${t.parameter}-parameters in ${t.parameter === 'Z' ? 'ohms' : 'siemens'}, not normalized (Touchstone 2.0)`
				: `! ${t.parameter}-parameters normalized to R = ${r} ohm (Touchstone 1.x convention): multiply ${t.parameter === 'Z' ? 'by' : 'divide by'} R for ${t.parameter === 'Z' ? 'ohms' : 'siemens'}`
		);
	if (v2) lines.push('[Version] 2.0');
	lines.push(`# ${t.unit} ${t.parameter} ${t.format} R ${r}`);
	if (v2)
		lines.push(
			'[Number of Ports] 2',
			'[Two-Port Data Order] 21_12',
			`[Number of Frequencies] ${t.f.length}`,
			`[Reference] ${r} ${r}`,
			'[Network Data]'
		);
	const [a, b] =
		t.format === 'RI' ? ['Re', 'Im'] : t.format === 'MA' ? ['Mag', 'Ang'] : ['dB', 'Ang'];
	const p = t.parameter;
	lines.push(
		`! freq ${[`${p}11`, `${p}21`, `${p}12`, `${p}22`].map((n) => `${a}${n} ${b}${n}`).join(' ')}`
	);
	t.f.forEach((f, i) => {
		const m = t.values[i];
		const order = [m[0][0], m[1][0], m[0][1], m[1][1]].map((c) => ({
			re: c.re * norm,
			im: c.im * norm
		}));
		lines.push(`${frequencyText(f, t.unit)} ${order.map((c) => pair(c, t.format)).join(' ')}`);
	});
	if (v2) lines.push('[End]');
	return `${lines.join('\r\n')}\r\n`;
}

/** Frequencies for the export: an explicit list, or log/linear spaced points (both ends included). */
export function frequencyList(spec: {
	list?: number[];
	fMin?: number;
	fMax?: number;
	points?: number;
	spacing?: 'log' | 'linear';
}): number[] {
	if (spec.list?.length) return [...spec.list].sort((x, y) => x - y);
	const { fMin = 1e3, fMax = 1e9, points = 101, spacing = 'log' } = spec;
	const n = Math.max(1, Math.floor(points));
	if (n === 1) return [fMin];
	return Array.from({ length: n }, (_, i) =>
		spacing === 'log'
			? 10 ** (Math.log10(fMin) + ((Math.log10(fMax) - Math.log10(fMin)) * i) / (n - 1))
			: fMin + ((fMax - fMin) * i) / (n - 1)
	);
}
