import { stepEvaluator } from './step-response';
import type { Modal } from './modal';

/**
 * When the poles span more than two decades, a linear time list from 0 to ten slowest time
 * constants has its first sample long after the edge (the demo divider: 3 µs against a 627 ps
 * rise). A plot with a logarithmic time axis then needs samples of its own: PER_DECADE a decade
 * from a hundredth of the fastest time constant to the end, as `logSpaced` beside `t` and `y`
 * (which keep the requested count), evaluated by the same pole–residue form. Only where that
 * form is the trusted one (step-choice.ts); the matrix-exponential path has none.
 */
export const LOG_SAMPLES_ABOVE_SPAN = 100;
const PER_DECADE = 24;

export function withLogSamples<S extends { t: number[]; y: number[] }>(
	step: S,
	md: Modal,
	tFast: number
): S & { logSpaced?: { t: number[]; y: number[] } } {
	const mags = md.poles.map((p) => Math.hypot(p.re, p.im)).filter((m) => m > 0);
	const span = mags.length ? Math.max(...mags) / Math.min(...mags) : 1;
	const tEnd = step.t[step.t.length - 1];
	const t0 = tFast / 100;
	if (!(span > LOG_SAMPLES_ABOVE_SPAN) || !(t0 > 0) || !(tEnd > t0)) return step;
	const decades = Math.log10(tEnd / t0);
	const n = Math.ceil(decades * PER_DECADE);
	const at = stepEvaluator(md);
	const t = Array.from({ length: n + 1 }, (_, i) => t0 * 10 ** ((decades * i) / n));
	return { ...step, logSpaced: { t, y: t.map(at) } };
}
