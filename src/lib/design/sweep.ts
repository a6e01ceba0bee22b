import { DesignError } from './errors';
import { metricsOf, type Band, type Metrics } from './evaluate';
import { evaluateWith, openVariants } from './variants';

/** One swept element: `points` values from `from` to `to`, evenly in value or in log(value). */
export interface SweepAxis {
	element: string;
	from: number;
	to: number;
	points: number;
	scale: 'linear' | 'log';
}

export interface SweepRequest {
	axes: SweepAxis[];
	band?: Band | null;
	inputAt?: number | null;
}

export interface SweepRow {
	values: number[];
	metrics: Metrics | null;
	error: string | null;
}

export interface SweepResult {
	elements: string[];
	/** Points per axis; rows run with the last axis fastest. */
	shape: number[];
	rows: SweepRow[];
	ms: number;
}

export const SWEEP_LIMITS = { pointsPerAxis: 1000, total: 4000 };

export function axisValues(a: SweepAxis): number[] {
	const n = Math.floor(a.points);
	if (!(n >= 2 && n <= SWEEP_LIMITS.pointsPerAxis)) {
		throw new DesignError(
			'bad_range',
			`sweep of "${a.element}": points must be 2 to ${SWEEP_LIMITS.pointsPerAxis}`,
			{ element: a.element }
		);
	}
	if (!Number.isFinite(a.from) || !Number.isFinite(a.to) || a.from === a.to) {
		throw new DesignError(
			'bad_range',
			`sweep of "${a.element}": from and to must be two different finite values`,
			{ element: a.element }
		);
	}
	if (a.scale === 'log' && !(a.from > 0 && a.to > 0)) {
		throw new DesignError(
			'bad_range',
			`sweep of "${a.element}": a logarithmic sweep needs positive from and to`,
			{ element: a.element }
		);
	}
	return Array.from({ length: n }, (_, i) => {
		const t = i / (n - 1);
		return a.scale === 'log' ? a.from * (a.to / a.from) ** t : a.from + (a.to - a.from) * t;
	});
}

export interface Progress {
	onProgress?: (done: number, total: number) => void;
	signal?: { aborted: boolean };
}

/** Sweep one element, or two on a grid; a point the solver refuses is kept with its reason. */
export function sweep(
	doc: unknown,
	req: SweepRequest,
	{ onProgress, signal }: Progress = {}
): SweepResult {
	const started = performance.now();
	if (req.axes.length < 1 || req.axes.length > 2)
		throw new DesignError('bad_range', 'a sweep has one or two elements');
	if (req.axes.length === 2 && req.axes[0].element === req.axes[1].element) {
		throw new DesignError('bad_range', `sweep: "${req.axes[0].element}" is on both axes`, {
			element: req.axes[0].element
		});
	}
	const grids = req.axes.map(axisValues);
	const total = grids.reduce((n, g) => n * g.length, 1);
	if (total > SWEEP_LIMITS.total)
		throw new DesignError(
			'too_many',
			`a sweep has at most ${SWEEP_LIMITS.total} points; this one has ${total}`
		);
	// Sweeps move values over decades: carry the reduction shift along with the poles.
	const v = openVariants(doc, { adaptShift: true });
	for (const a of req.axes) evaluateWith(v, { [a.element]: grids[0][0] }, { step: false }); // names a bad element early
	const rows: SweepRow[] = [];
	for (let i = 0; i < total; i++) {
		if (signal?.aborted) throw new DesignError('cancelled', 'the sweep was cancelled');
		const idx =
			req.axes.length === 1 ? [i] : [Math.floor(i / grids[1].length), i % grids[1].length];
		const values = idx.map((k, ax) => grids[ax][k]);
		const assignment = Object.fromEntries(req.axes.map((a, ax) => [a.element, values[ax]]));
		try {
			const e = evaluateWith(v, assignment, {
				band: req.band ?? null,
				inputAt: req.inputAt ?? undefined
			});
			rows.push({ values, metrics: metricsOf(e), error: null });
		} catch (err) {
			rows.push({ values, metrics: null, error: err instanceof Error ? err.message : String(err) });
		}
		onProgress?.(i + 1, total);
	}
	return {
		elements: req.axes.map((a) => a.element),
		shape: grids.map((g) => g.length),
		rows,
		ms: performance.now() - started
	};
}
