import type { ElementTolerance, SpecLimits } from '../network/design-schema';
import { DesignError } from './errors';
import { metricsOf, type Metrics } from './evaluate';
import { elementOf } from './prepared';
import { normal, runStream } from './random';
import { checkSpec, isEmptySpec, optionsFor } from './spec-limits';
import { findClusters, type Cluster } from './clusters';
import { histogram, statistics, type Histogram, type Statistics } from './statistics';
import { evaluateWith, openVariants, type Variants } from './variants';

/**
 * Monte Carlo tolerance runs on one prepared network: each run draws every toleranced element
 * (uniform over ±t, or normal with t = 3σ, not truncated; "fixed" stays nominal), evaluates the
 * figures on the reused structure, and judges them against the spec limits. Run i draws from
 * its own stream derived from (seed, i), so any split into chunks gives identical results.
 */
export interface MonteCarloRequest {
	tolerances: ElementTolerance[];
	runs: number;
	seed: number;
	spec?: SpecLimits;
	/** How many of the slowest poles get their own statistics. */
	dominantPoles?: number;
}

export const FIGURES = [
	'bandwidth',
	'dcGain',
	'overshoot',
	'riseTime',
	'flatnessDb',
	'inputResistance',
	'inputCapacitance'
] as const;
export type Figure = (typeof FIGURES)[number];

/** One run, compact: figures (null when undefined), dominant pole frequencies (Hz), pass. */
export interface RunRecord {
	run: number;
	figures: (number | null)[];
	poles: (number | null)[];
	pass: boolean | null;
	error?: string;
}

export interface FigureSummary {
	figure: string;
	stats: Statistics;
	histogram: Histogram;
	/** Separate populations (clusters.ts); when set, mean and σ describe no run: show these. */
	clusters: Cluster[] | null;
}

export interface MonteCarloResult {
	runs: number;
	seed: number;
	figures: FigureSummary[];
	poles: FigureSummary[];
	yield: {
		pass: number;
		runs: number;
		fraction: number;
		standardError: number;
		byCheck: { key: string; label: string; fraction: number }[];
	} | null;
	failed: number;
	nominal: Metrics;
}

export interface Progress {
	onProgress?: (done: number, total: number) => void;
	signal?: { aborted: boolean };
}

export function drawValues(
	v: Variants,
	tolerances: ElementTolerance[],
	seed: number,
	run: number
): Record<string, number> {
	const rand = runStream(seed, run);
	const out: Record<string, number> = {};
	for (const t of tolerances) {
		const x = v.prepared.byId.get(t.element)!.nominal;
		if (t.distribution === 'fixed' || t.tolerance === 0) continue;
		const k =
			t.distribution === 'uniform'
				? (2 * rand() - 1) * t.tolerance
				: (normal(rand) * t.tolerance) / 3;
		out[t.element] = x * (1 + k);
	}
	return out;
}

export function checkTolerances(v: Variants, tolerances: ElementTolerance[]): void {
	for (const t of tolerances) elementOf(v.prepared, t.element);
}

/** Runs [from, to) of a Monte Carlo request on an opened network (a worker's chunk). */
export function monteCarloChunk(
	v: Variants,
	req: MonteCarloRequest,
	from: number,
	to: number,
	{ signal }: Progress = {}
): RunRecord[] {
	const opts = { ...optionsFor(req.spec ?? {}) };
	const k = req.dominantPoles ?? 3;
	const out: RunRecord[] = [];
	for (let run = from; run < to; run++) {
		if (signal?.aborted) throw new DesignError('cancelled', 'the tolerance run was cancelled');
		try {
			const m = evaluateWith(v, drawValues(v, req.tolerances, req.seed, run), opts);
			out.push({
				run,
				figures: FIGURES.map((f) => m[f]),
				poles: Array.from({ length: k }, (_, i) =>
					m.poles[i] ? Math.hypot(m.poles[i].re, m.poles[i].im) / (2 * Math.PI) : null
				),
				pass: hasLimits(req) ? checkSpec(req.spec!, m).pass : null
			});
		} catch (e) {
			out.push({
				run,
				figures: FIGURES.map(() => null),
				poles: [],
				pass: false,
				error: e instanceof Error ? e.message : String(e)
			});
		}
	}
	return out;
}

export function summarize(
	v: Variants,
	req: MonteCarloRequest,
	records: RunRecord[]
): MonteCarloResult {
	const nominal = evaluateWith(v, {}, optionsFor(req.spec ?? {}));
	const col = (get: (r: RunRecord) => number | null) =>
		records.map(get).filter((x): x is number => x !== null && Number.isFinite(x));
	const summary = (figure: string, xs: number[]): FigureSummary => ({
		figure,
		stats: statistics(xs, records.length),
		histogram: histogram(xs, 30),
		clusters: findClusters(xs)
	});
	const figures = FIGURES.map((f, i) =>
		summary(
			f,
			col((r) => r.figures[i])
		)
	).filter((s) => s.stats.count > 0);
	const k = req.dominantPoles ?? 3;
	const poles = Array.from({ length: k }, (_, i) =>
		summary(
			`pole${i + 1}_hz`,
			col((r) => r.poles[i] ?? null)
		)
	).filter((s) => s.stats.count > 0);
	let yieldResult: MonteCarloResult['yield'] = null;
	// A yield needs limits: with none set, "100 % ± 0 %" would be a verdict on nothing.
	if (hasLimits(req)) {
		const pass = records.filter((r) => r.pass).length;
		const n = records.length;
		const fraction = n ? pass / n : 0;
		// Per-check pass fractions from the stored figures, so a failing yield says which limit bites.
		const checks = checkSpec(req.spec!, nominal).checks;
		const byCheck = checks.map((c) => {
			const idx = FIGURES.indexOf(c.key === 'flatness' ? 'flatnessDb' : (c.key as Figure));
			const ok = records.filter((r) => {
				const fig = Object.fromEntries(FIGURES.map((f, j) => [f, r.figures[j]])) as Record<
					Figure,
					number | null
				>;
				return idx >= 0 && checkSpec(req.spec!, fig).checks.find((x) => x.key === c.key)?.pass;
			}).length;
			return { key: c.key, label: c.label, fraction: n ? ok / n : 0 };
		});
		yieldResult = {
			pass,
			runs: n,
			fraction,
			standardError: Math.sqrt((fraction * (1 - fraction)) / Math.max(1, n)),
			byCheck
		};
	}
	return {
		runs: records.length,
		seed: req.seed,
		figures,
		poles,
		yield: yieldResult,
		failed: records.filter((r) => r.error).length,
		nominal: metricsOf(nominal)
	};
}

const hasLimits = (req: MonteCarloRequest) => !!req.spec && !isEmptySpec(req.spec);

export const CHUNK = 250;

/** The whole run in one call (the library entry; the server splits it into chunks itself). */
export function monteCarlo(
	doc: unknown,
	req: MonteCarloRequest,
	{ onProgress, signal }: Progress = {}
): MonteCarloResult {
	if (!(req.runs >= 1 && req.runs <= 10_000))
		throw new DesignError('too_many', 'a Monte Carlo run has 1 to 10,000 runs');
	const v = openVariants(doc);
	checkTolerances(v, req.tolerances);
	const records: RunRecord[] = [];
	for (let from = 0; from < req.runs; from += CHUNK) {
		records.push(...monteCarloChunk(v, req, from, Math.min(req.runs, from + CHUNK), { signal }));
		onProgress?.(records.length, req.runs);
	}
	return summarize(v, req, records);
}
