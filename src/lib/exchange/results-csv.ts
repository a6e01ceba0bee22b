// The analysis as CSV for spreadsheets and scripts: one table per file, SI base units named in
// each column title, full precision (the shortest text that reads back as the same double),
// an empty cell where the solver says null (infinite or undefined). Text cells (element ids,
// owners) are guarded against formula injection (formula-guard.ts); numbers stay numbers.
import Papa from 'papaparse';
import type { Analysis } from '../solver';
import { FORMULA_START } from './formula-guard';

export const RESULT_TABLES = ['poles', 'time-constants', 'response', 'step'] as const;
export type ResultTable = (typeof RESULT_TABLES)[number];

type Cell = string | number | null | undefined;

// Numbers stay numbers, so papaparse's formula escape (text cells only) never touches "-1.5e3".
const cell = (v: Cell) =>
	v === null || v === undefined ? '' : typeof v === 'number' ? (Number.isFinite(v) ? v : '') : v;

function csv(fields: string[], rows: Cell[][]): string {
	// "\r\n" is what RFC 4180 asks for; spreadsheets read either. escapeFormulae prefixes an
	// apostrophe and quotes every text cell that starts like a formula (OWASP CSV Injection).
	const text = Papa.unparse(
		{ fields, data: rows.map((r) => r.map(cell)) },
		{ newline: '\r\n', escapeFormulae: FORMULA_START }
	);
	return `${text}\r\n`;
}

export function polesCsv(a: Analysis): string {
	const rows: Cell[][] = [];
	a.poles.forEach((p, i) =>
		rows.push([
			'pole',
			i + 1,
			p.re,
			p.im,
			p.hz,
			p.q,
			p.zeta,
			p.tau,
			p.estimate?.method,
			p.estimate?.element,
			p.estimate?.tau,
			p.estimate?.hz,
			p.relativeError,
			p.owners.map((o) => `${o.element} ${(o.share * 100).toFixed(1)}%`).join('; '),
			p.cancelledBy === null ? null : `zero ${p.cancelledBy + 1}`
		])
	);
	a.zeros.forEach((z, i) =>
		rows.push([
			'zero',
			i + 1,
			z.re,
			z.im,
			z.hz,
			z.q,
			z.zeta,
			z.tau,
			null,
			null,
			null,
			null,
			null,
			null,
			z.cancels === null ? null : `pole ${z.cancels + 1}`
		])
	);
	return csv(
		[
			'kind',
			'index',
			're_rad_per_s',
			'im_rad_per_s',
			'frequency_hz',
			'q',
			'zeta',
			'tau_s',
			'estimate_method',
			'estimate_element',
			'estimate_tau_s',
			'estimate_hz',
			'estimate_relative_error',
			'owners',
			'near_cancellation'
		],
		rows
	);
}

export function timeConstantsCsv(a: Analysis): string {
	const tc = a.timeConstants;
	const rank = new Map(tc.sequential.map((s, i) => [s.element, { i: i + 1, tau: s.tau }]));
	const kinds = new Map(a.portMatrices.ports.map((p, i) => [p, a.portMatrices.kinds[i]]));
	const rows = tc.openCircuit.map((o, i) => {
		const s = tc.shortCircuit[i];
		const r = rank.get(o.element);
		return [
			o.element,
			kinds.get(o.element) ?? null,
			o.members.join(' '),
			o.value,
			o.resistance,
			o.tau,
			s?.resistance,
			s?.tau,
			r?.i,
			r?.tau
		] as Cell[];
	});
	return csv(
		[
			'element',
			'kind',
			'members',
			'value',
			'open_circuit_resistance_ohm',
			'open_circuit_tau_s',
			'short_circuit_resistance_ohm',
			'short_circuit_tau_s',
			'sequential_rank',
			'sequential_tau_s'
		],
		rows
	);
}

export function responseCsv(a: Analysis): string {
	const r = a.frequencyResponse;
	if (!r) return csv(['frequency_hz', 'magnitude_db', 'phase_deg', 'group_delay_s'], []);
	return csv(
		['frequency_hz', 'magnitude_db', 'phase_deg', 'group_delay_s'],
		r.f.map((f, i) => [f, r.magnitudeDb[i], r.phaseDeg[i], r.groupDelay[i]])
	);
}

export function stepCsv(a: Analysis): string {
	const s = a.step;
	if (!s) return csv(['time_s', 'output'], []);
	return csv(
		['time_s', 'output'],
		s.t.map((t, i) => [t, s.y[i]])
	);
}

export function resultsCsv(a: Analysis, table: ResultTable): string {
	return {
		poles: polesCsv,
		'time-constants': timeConstantsCsv,
		response: responseCsv,
		step: stepCsv
	}[table](a);
}
