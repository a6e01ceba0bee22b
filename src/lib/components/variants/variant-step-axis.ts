// The time axis of the variants' overlaid step responses. With poles decades apart (a divider's
// edge in picoseconds, its tail in microseconds) a linear axis shows every step as a vertical line
// at 0, so the axis is logarithmic by default when the poles of all variants together span more
// than LOG_TIME_ABOVE_SPAN — the same rule as the single step plot — and each curve then uses its
// even samples together with its log-spaced ones (the analysis sends those when its own poles
// span more than two decades), leaving out t = 0.
import { LOG_TIME_ABOVE_SPAN, poleSpan } from '$lib/components/plots/plot-zoom';

export interface StepSamples {
	t: number[];
	y: number[];
	logSpaced?: { t: number[]; y: number[] };
}

/** Log time by default when the poles of every variant together span more than two decades. */
export function logTimeByDefault(poleSets: { re: number; im: number }[][]): boolean {
	return poleSpan(poleSets.flat()) > LOG_TIME_ABOVE_SPAN;
}

/** One curve's samples on the chosen axis, ascending in t (only t > 0 on a log axis). */
export function stepSamples(s: StepSamples, log: boolean): { t: number[]; y: number[] } {
	if (!log) return { t: s.t, y: s.y };
	const pts = [
		...s.t.map((v, i) => [v, s.y[i]]),
		...(s.logSpaced?.t ?? []).map((v, i) => [v, s.logSpaced!.y[i]])
	]
		.filter((p) => p[0] > 0)
		.sort((a, b) => a[0] - b[0]);
	return { t: pts.map((p) => p[0]), y: pts.map((p) => p[1]) };
}

/** The time domain that holds every curve: [0, last] linear, [first t > 0, last] log. */
export function stepDomain(curves: { t: number[] }[], log: boolean): [number, number] {
	const t1 = Math.max(...curves.map((c) => c.t[c.t.length - 1] ?? 0));
	if (!log) return [0, t1];
	const t0 = Math.min(...curves.map((c) => c.t.find((v) => v > 0) ?? t1));
	return [t0 < t1 ? t0 : t1 / 10, t1];
}
