import type { Metrics } from './evaluate';
import { guardCell } from '../exchange/formula-guard';

/**
 * Rows of figures as a table and as CSV (RFC 4180: comma separated, a header line, quoted
 * only where needed). Numbers are written with full precision so a spreadsheet gets what the
 * solver computed; poles and zeros get one real/imaginary column pair each, slowest first.
 */
export const METRIC_COLUMNS: { key: keyof Metrics; label: string }[] = [
	{ key: 'dcGain', label: 'dc_gain' },
	{ key: 'bandwidth', label: 'bandwidth_hz' },
	{ key: 'riseTime', label: 'rise_time_s' },
	{ key: 'overshoot', label: 'overshoot_pct' },
	{ key: 'settlingTime', label: 'settling_time_s' },
	{ key: 'flatnessDb', label: 'flatness_db' },
	{ key: 'maxQ', label: 'max_q' },
	{ key: 'inputResistance', label: 'input_resistance_ohm' },
	{ key: 'inputCapacitance', label: 'input_capacitance_f' }
];

const cell = (x: unknown): string => {
	if (x === null || x === undefined) return '';
	if (typeof x === 'number') return Number.isFinite(x) ? String(x) : '';
	// Element ids head the value columns and messages fill the last: guard them (OWASP CSV
	// Injection), then quote the way RFC 4180 asks.
	const s = guardCell(String(x));
	return /[",\n\r]/.test(s) || s !== String(x) ? `"${s.replace(/"/g, '""')}"` : s;
};

export function metricsCsv(
	valueColumns: string[],
	rows: { values: number[]; metrics: Metrics | null; error?: string | null }[]
): string {
	const poles = Math.max(0, ...rows.map((r) => r.metrics?.poles.length ?? 0));
	const zeros = Math.max(0, ...rows.map((r) => r.metrics?.zeros.length ?? 0));
	const header = [
		...valueColumns,
		...METRIC_COLUMNS.map((c) => c.label),
		...Array.from({ length: poles }, (_, i) => [`pole${i + 1}_re`, `pole${i + 1}_im`]).flat(),
		...Array.from({ length: zeros }, (_, i) => [`zero${i + 1}_re`, `zero${i + 1}_im`]).flat(),
		'error'
	];
	const lines = rows.map((r) => {
		const m = r.metrics;
		const pz = (list: { re: number; im: number }[] | undefined, n: number) =>
			Array.from({ length: n }, (_, i) =>
				list && list[i] ? [list[i].re, list[i].im] : [null, null]
			).flat();
		return [
			...r.values,
			...METRIC_COLUMNS.map((c) => (m ? (m[c.key] as number | null) : null)),
			...pz(m?.poles, poles),
			...pz(m?.zeros, zeros),
			r.error ?? ''
		]
			.map(cell)
			.join(',');
	});
	return [header.map(cell).join(','), ...lines].join('\r\n') + '\r\n';
}
