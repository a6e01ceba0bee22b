import { brentMinimize, brentRoot } from './brent';
import { defaultBand } from './band';
import { DesignError } from './errors';
import {
	magnitudeDb,
	metricsOf,
	stepCurve,
	type Band,
	type Evaluation,
	type Metrics
} from './evaluate';
import { snapToSeries, type Series } from './preferred-values';
import { evaluateWith, nominalOf, openVariants, type Variants } from './variants';
import { logSpace } from '../solver/frequency-response';
import { frequencyRange } from '../solver/response-range';
import { formatEngineering } from '../solver/format';
import { assertSolvable, trimRange, trimmerSetting } from './roles';
import type { NetworkDocument } from '../network/schema';

/**
 * Solve for one element's value. "flat" minimizes the worst deviation of |H| from its DC value
 * over a band (for a compensated divider: the pole–zero cancellation); the other goals find
 * where a figure crosses a target. Both search in log(value): component values are judged by
 * ratio, and a decade either way is the same effort for the search.
 */
export type Goal =
	| { kind: 'flat'; band?: Band }
	| { kind: 'bandwidth'; target: number }
	| { kind: 'q'; target: number }
	| { kind: 'overshoot'; target: number }
	| { kind: 'dcGain'; target: number };

export interface SolveRequest {
	element: string;
	goal: Goal;
	range?: { from: number; to: number };
	series?: Series;
}

export interface Variant {
	value: number;
	/** The goal's figure: flatness dB, bandwidth Hz, Q, overshoot %, or DC gain. */
	figure: number | null;
	metrics: Metrics;
}

export interface SolveResult {
	element: string;
	goal: Goal;
	band: Band | null;
	value: number;
	figure: number | null;
	iterations: number;
	/** True when the best value sits at an end of the range (widen it to be sure). */
	atRangeEdge: boolean;
	before: Variant;
	after: Variant;
	/** Preferred-value neighbours; null for a trimmer (it is set by adjustment, not bought). */
	preferred: { series: Series; below: Variant; above: Variant; nearest: 'below' | 'above' } | null;
	/** For a trimmer: its range and where the answer sits on it (0 … 1), or that it is outside. */
	trimmer: { min: number; max: number; position: number; inRange: boolean } | null;
	response: { f: number[]; beforeDb: (number | null)[]; afterDb: (number | null)[] };
	step: { t: number[]; before: number[]; after: number[] };
}

const FIGURE: Record<
	Goal['kind'],
	{ label: string; unit: string; of: (m: Metrics) => number | null }
> = {
	flat: { label: 'flatness', unit: 'dB', of: (m) => m.flatnessDb },
	bandwidth: { label: 'bandwidth', unit: 'Hz', of: (m) => m.bandwidth },
	q: { label: 'pole Q', unit: '', of: (m) => m.maxQ },
	overshoot: { label: 'overshoot', unit: '%', of: (m) => m.overshoot },
	dcGain: { label: 'DC gain', unit: '', of: (m) => m.dcGain }
};

const SCAN_POINTS = 41;

export function solveForValue(doc: unknown, req: SolveRequest): SolveResult {
	const v = openVariants(doc);
	const x0 = nominalOf(v, req.element);
	const el = (doc as NetworkDocument).elements.find((e) => e.id === req.element)!;
	assertSolvable(doc as NetworkDocument, req.element);
	const trim = trimRange(el);
	// A trimmer's search covers its range and a decade beyond either end, so an answer outside
	// the range is found and said, not clipped to the end stop.
	const range = req.range ?? (trim ? { from: Math.min(trim.min, Math.abs(x0)) / 10, to: Math.max(trim.max, Math.abs(x0)) * 10 } : { from: Math.abs(x0) / 10, to: Math.abs(x0) * 10 });
	if (!(range.from > 0 && range.to > range.from && Number.isFinite(range.to))) {
		throw new DesignError(
			'bad_range',
			`solve for "${req.element}": the range must be two positive values, low then high`,
			{ element: req.element }
		);
	}
	const sign = x0 < 0 ? -1 : 1;
	const nominal = evaluateWith(v, {});
	const band = req.goal.kind === 'flat' ? (req.goal.band ?? defaultBand(nominal)) : null;
	const figureAt = (x: number): number | null => {
		try {
			return FIGURE[req.goal.kind].of(
				evaluateWith(v, { [req.element]: sign * x }, { band, step: needsStep(req.goal) })
			);
		} catch {
			return null;
		}
	};
	const lo = Math.log(range.from);
	const hi = Math.log(range.to);
	const grid = Array.from(
		{ length: SCAN_POINTS },
		(_, i) => lo + ((hi - lo) * i) / (SCAN_POINTS - 1)
	);
	const scan = grid.map((u) => figureAt(Math.exp(u)));
	const found =
		req.goal.kind === 'flat'
			? minimizeFlat(grid, scan, figureAt)
			: findTarget(req, grid, scan, figureAt, Math.log(Math.abs(x0)), range);
	const value = sign * Math.exp(found.u);
	const series = req.series ?? 'E24';
	const snapped = snapToSeries(Math.abs(value), series);
	const variant = (x: number): Variant => {
		const e = evaluateWith(v, { [req.element]: x }, { band });
		return { value: x, figure: FIGURE[req.goal.kind].of(e), metrics: metricsOf(e) };
	};
	const before = variant(x0);
	const after = variant(value);
	return {
		element: req.element,
		goal: req.goal,
		band,
		value,
		figure: after.figure,
		iterations: found.iterations,
		atRangeEdge: found.edge,
		before,
		after,
		preferred: trim
			? null
			: {
					series,
					below: variant(sign * snapped.below),
					above: variant(sign * snapped.above),
					nearest: snapped.nearest === snapped.below ? 'below' : 'above'
				},
		trimmer: trimmerSetting(el, value),
		...curves(v, req.element, x0, value)
	};
}

const needsStep = (g: Goal) => g.kind === 'overshoot';

function minimizeFlat(grid: number[], scan: (number | null)[], f: (x: number) => number | null) {
	let best = -1;
	scan.forEach((y, i) => {
		if (y !== null && (best < 0 || y < scan[best]!)) best = i;
	});
	if (best < 0)
		throw new DesignError(
			'no_solution',
			'the response has no DC value to be flat against anywhere in the range'
		);
	const a = grid[Math.max(0, best - 1)];
	const b = grid[Math.min(grid.length - 1, best + 1)];
	const r = brentMinimize((u) => f(Math.exp(u)) ?? Number.MAX_VALUE, a, b, 1e-12);
	const edge =
		(best === 0 || best === grid.length - 1) &&
		Math.min(Math.abs(r.x - grid[0]), Math.abs(r.x - grid[grid.length - 1])) < 1e-6;
	return { u: r.x, iterations: r.iterations, edge };
}

function findTarget(
	req: SolveRequest,
	grid: number[],
	scan: (number | null)[],
	f: (x: number) => number | null,
	u0: number,
	range: { from: number; to: number }
) {
	const target = (req.goal as { target: number }).target;
	const g = (u: number) => {
		const y = f(Math.exp(u));
		return y === null ? NaN : y - target;
	};
	const brackets: [number, number][] = [];
	for (let i = 1; i < grid.length; i++) {
		const a = scan[i - 1];
		const b = scan[i];
		if (a === null || b === null) continue;
		if ((a - target) * (b - target) <= 0) brackets.push([grid[i - 1], grid[i]]);
	}
	if (brackets.length === 0) {
		const seen = scan.filter((y): y is number => y !== null);
		const fig = FIGURE[req.goal.kind];
		const fmt = (x: number) => formatEngineering(x, fig.unit);
		const span = seen.length
			? `; there it spans ${fmt(Math.min(...seen))} to ${fmt(Math.max(...seen))}`
			: `; there it is undefined`;
		throw new DesignError(
			'no_solution',
			`no value of "${req.element}" from ${formatEngineering(range.from)} to ${formatEngineering(range.to)} gives a ${fig.label} of ${fmt(target)}${span}`,
			{ element: req.element }
		);
	}
	// Several crossings: the one nearest today's value is the change a designer means.
	brackets.sort((p, q) => Math.abs((p[0] + p[1]) / 2 - u0) - Math.abs((q[0] + q[1]) / 2 - u0));
	const [a, b] = brackets[0];
	const r = brentRoot(g, a, b, 1e-13);
	return { u: r.x, iterations: r.iterations, edge: false };
}

function curves(v: Variants, id: string, x0: number, x1: number) {
	const e0: Evaluation = evaluateWith(v, { [id]: x0 });
	const e1: Evaluation = evaluateWith(v, { [id]: x1 });
	const r = frequencyRange([...e0.poles, ...e1.poles], [...e0.zeros, ...e1.zeros]);
	const f = logSpace(r.fMin, r.fMax, 200);
	const slow = Math.min(
		...[...e0.poles, ...e1.poles].map((p) => Math.abs(p.re)).filter((x) => x > 0),
		Infinity
	);
	const tEnd = Number.isFinite(slow) ? 5 / slow : 1;
	const s0 = stepCurve(e0, tEnd);
	const s1 = stepCurve(e1, tEnd);
	return {
		response: { f, beforeDb: magnitudeDb(e0, f), afterDb: magnitudeDb(e1, f) },
		step: { t: s0.t, before: s0.y, after: s1.y }
	};
}

export { FIGURE as GOAL_FIGURES };
