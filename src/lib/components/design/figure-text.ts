// How a tolerance run's figure reads. Dimensionless figures (gains) are plain numbers with their
// dB — never SI prefixes ("98.37m", "σ 739µ" are not how a gain is read); a figure that falls
// into separate clusters is described by its clusters and percentiles, not by mean ± σ (which
// would describe no run at all).
import type { Cluster } from '$lib/design/clusters';
import type { Statistics } from '$lib/design/statistics';
import { withUnit } from './units';
import { decibels } from '$lib/review/gain-text';

const plain = (v: number, digits = 4) => {
	if (v === 0) return '0';
	const a = Math.abs(v);
	// Plain digits between 1e-4 and 1e6; outside, scientific notation (still no prefixes).
	return a >= 1e-4 && a < 1e6 ? String(Number(v.toPrecision(digits))) : v.toExponential(digits - 1);
};

/** A value of the figure in its own unit; '' is a dimensionless gain (plain, with dB). */
export function figureValue(v: number | null | undefined, unit: string, digits = 4): string {
	if (v === null || v === undefined || Number.isNaN(v)) return '—';
	if (unit === '')
		return Math.abs(v) > 0
			? `${plain(v, digits)} (${decibels(v)} dB)`
			: plain(v, digits);
	if (unit === '%') return `${plain(v, 3)} %`;
	return withUnit(v, unit, digits);
}

/** A spread (σ) of the figure: a gain's σ plain and as a share of the mean. */
export function spreadValue(std: number, mean: number, unit: string): string {
	if (Number.isNaN(std)) return '—';
	if (unit === '')
		return mean !== 0
			? `${plain(std, 3)} (${plain((std / Math.abs(mean)) * 100, 2)} % of the mean)`
			: plain(std, 3);
	if (unit === '%') return `${plain(std, 3)} %`;
	return withUnit(std, unit, 3);
}

const COUNT = ['', 'one', 'two', 'three', 'four'];
const pct = (f: number) => `${Math.round(f * 100)} %`;

/** The line under a histogram. */
export function summaryLine(
	s: { stats: Statistics; clusters?: Cluster[] | null },
	unit: string
): string {
	const v = (x: number) => figureValue(x, unit);
	const percentiles = `1 %, 50 %, 99 % of runs: ${v(s.stats.p01)}, ${v(s.stats.p50)}, ${v(s.stats.p99)}`;
	if (s.clusters && s.clusters.length > 1) {
		const groups = s.clusters
			.map((c) => `${pct(c.fraction)} near ${v(c.p50)} (${v(c.min)} to ${v(c.max)})`)
			.join('; ');
		// The median of a split sample can fall in the gap, a value no run had: ends only.
		return `Not one population — ${COUNT[s.clusters.length] ?? s.clusters.length} clusters: ${groups}. 1 % and 99 % of runs: ${v(s.stats.p01)}, ${v(s.stats.p99)}`;
	}
	return `mean ${v(s.stats.mean)} · σ ${spreadValue(s.stats.std, s.stats.mean, unit)} · ${percentiles}`;
}

/** A short axis label: a gain plain (no dB, no prefix), other figures in their unit. */
export const axisValue = (v: number, unit: string) =>
	unit === '' ? plain(v, 3) : unit === '%' ? `${plain(v, 3)} %` : withUnit(v, unit, 3);
