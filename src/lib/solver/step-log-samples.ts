import { stepEvaluator } from './step-response';
import type { Modal } from './modal';
import type { Analysis } from './types';

/**
 * When the poles span more than two decades, a linear time list from 0 to ten slowest time
 * constants has its first sample long after the edge (the demo divider: 3 µs against a 627 ps
 * rise). The step plot's logarithmic time axis then needs samples of its own: PER_DECADE a
 * decade from a hundredth of the fastest time constant to the end, merged into `t` (ascending,
 * still starting at 0), evaluated by the same pole–residue form as the rest.
 */
export const LOG_SAMPLES_ABOVE_SPAN = 100;
const PER_DECADE = 24;

export function withLogSamples(
	step: NonNullable<Analysis['step']>,
	md: Modal,
	tFast: number,
	span: number
): NonNullable<Analysis['step']> {
	const tEnd = step.t[step.t.length - 1];
	const t0 = tFast / 100;
	if (!(span > LOG_SAMPLES_ABOVE_SPAN) || !(t0 > 0) || !(tEnd > t0)) return step;
	const decades = Math.log10(tEnd / t0);
	const n = Math.ceil(decades * PER_DECADE);
	const at = stepEvaluator(md);
	const extra = Array.from({ length: n }, (_, i) => t0 * 10 ** ((decades * i) / n));
	const merged = [
		...step.t.map((t, i) => [t, step.y[i]] as const),
		...extra.map((t) => [t, at(t)] as const)
	];
	merged.sort((a, b) => a[0] - b[0]);
	return { ...step, t: merged.map((p) => p[0]), y: merged.map((p) => p[1]) };
}
