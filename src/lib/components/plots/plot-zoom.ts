// What the step and frequency plots show: the whole response, the edge or the tail, on a linear
// or a logarithmic time axis. One choice drives both plots: a time window [t0, t1] corresponds to
// the frequencies [1/(2π·t1), 1/(2π·t0)] (a feature at time t is shaped near f = 1/(2πt)), so the
// edge of the step is the top of the frequency response and the tail its bottom.

export type ZoomMode = 'all' | 'edge' | 'tail';

export interface StepLike {
	t: number[];
	y: number[];
	riseTime: number | null;
	settlingTime: number | null;
	final: number | null;
}

/** Poles spanning more than this ratio get a logarithmic time axis by default. */
export const LOG_TIME_ABOVE_SPAN = 100;

export function poleSpan(poles: { re: number; im: number }[]): number {
	const mags = poles.map((p) => Math.hypot(p.re, p.im)).filter((m) => m > 0 && Number.isFinite(m));
	return mags.length ? Math.max(...mags) / Math.min(...mags) : 1;
}

/** First time the response reaches `level` of its final value (linear interpolation), or null. */
export function crossing(s: StepLike, level: number): number | null {
	const fin = s.final ?? s.y[s.y.length - 1];
	if (!Number.isFinite(fin) || fin === 0) return null;
	const target = level * fin;
	for (let i = 1; i < s.t.length; i++) {
		const [a, b] = [s.y[i - 1] / fin, s.y[i] / fin];
		if (a < level && b >= level) {
			const u = (level - a) / (b - a);
			return s.t[i - 1] + u * (s.t[i] - s.t[i - 1]);
		}
	}
	return Math.abs(s.y[0]) >= Math.abs(target) ? s.t[0] : null;
}

/**
 * The time window of a zoom: the edge runs from a little before the 10 % crossing to a few rise
 * times after 90 %; the tail from there to the end of the response. `log` windows start
 * above 0.
 */
export function timeWindow(s: StepLike, mode: ZoomMode, log: boolean): [number, number] {
	const tEnd = s.t[s.t.length - 1];
	const tFirst = s.t.find((t) => t > 0) ?? tEnd;
	const whole: [number, number] = [log ? tFirst : 0, tEnd];
	if (mode === 'all') return whole;
	const t10 = crossing(s, 0.1);
	const t90 = crossing(s, 0.9);
	const rise = s.riseTime ?? (t10 !== null && t90 !== null ? t90 - t10 : null);
	if (t10 === null || t90 === null || rise === null || !(rise > 0)) return whole;
	const edgeEnd = Math.min(tEnd, t90 + 4 * rise);
	if (mode === 'edge') {
		const lo = log ? Math.max(tFirst, t10 / 10) : Math.max(0, t10 - 2 * rise);
		return [lo, log ? Math.min(tEnd, t90 * 10) : edgeEnd];
	}
	// The tail runs to the end of the computed response (ten slowest time constants).
	return tEnd > edgeEnd ? [edgeEnd, tEnd] : whole;
}

/** The frequency range that matches a time window, inside the plotted [fMin, fMax]. */
export function frequencyWindow(
	window: [number, number],
	fMin: number,
	fMax: number
): [number, number] {
	const hi = window[0] > 0 ? Math.min(fMax, 1 / (2 * Math.PI * window[0])) : fMax;
	const lo = Math.max(fMin, 1 / (2 * Math.PI * window[1]));
	// Keep at least a decade on screen.
	if (!(hi > lo * 10)) {
		const mid = Math.sqrt(Math.max(lo, fMin) * Math.min(Math.max(hi, lo), fMax));
		return [Math.max(fMin, mid / Math.sqrt(10)), Math.min(fMax, mid * Math.sqrt(10))];
	}
	return [lo, hi];
}

/** y range of the samples inside [t0, t1], padded; the tail view keeps the final value ±1 % in sight. */
export function valueRange(
	s: StepLike,
	window: [number, number],
	mode: ZoomMode
): [number, number] {
	let lo = Infinity;
	let hi = -Infinity;
	s.t.forEach((t, i) => {
		if (t < window[0] || t > window[1]) return;
		lo = Math.min(lo, s.y[i]);
		hi = Math.max(hi, s.y[i]);
	});
	const fin = s.final ?? s.y[s.y.length - 1];
	if (mode === 'tail' && Number.isFinite(fin)) {
		lo = Math.min(lo, fin * 0.985);
		hi = Math.max(hi, fin * 1.015);
	} else if (mode === 'all') {
		lo = Math.min(lo, 0);
		if (Number.isFinite(fin)) hi = Math.max(hi, fin * 1.05);
	}
	if (!Number.isFinite(lo) || !Number.isFinite(hi)) return [0, 1];
	const pad = (hi - lo) * 0.05 || Math.abs(hi) * 0.05 || 1;
	return [lo - (mode === 'all' ? 0 : pad), hi + pad];
}

/**
 * Measured phase lifted by whole turns onto the model's unwrapped phase (a meter reports it
 * wrapped to ±180°): each point is unwrapped against the one before, then the whole curve is
 * moved by the turns that bring its first in-range point nearest the model there.
 */
export function alignPhase(
	f: number[],
	phase: number[],
	modelF: number[],
	modelPhase: (number | null)[]
): number[] {
	const out: number[] = [];
	for (let i = 0; i < phase.length; i++) {
		let p = phase[i];
		if (i > 0) while (p - out[i - 1] > 180) p -= 360;
		if (i > 0) while (p - out[i - 1] < -180) p += 360;
		out.push(p);
	}
	const k = out.findIndex((_, i) => f[i] >= modelF[0] && f[i] <= modelF[modelF.length - 1]);
	if (k < 0) return out;
	let j = 0;
	while (j < modelF.length - 1 && modelF[j + 1] <= f[k]) j++;
	const ref = modelPhase[j];
	if (ref === null || !Number.isFinite(ref)) return out;
	const turns = Math.round((ref - out[k]) / 360);
	return out.map((p) => p + 360 * turns);
}
