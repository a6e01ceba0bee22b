import type { ElementTolerance, SpecLimits } from '../network/design-schema';
import { DesignError } from './errors';
import { checkSpec, isEmptySpec, optionsFor, type SpecOutcome } from './spec-limits';
import { FIGURES, checkTolerances, type Figure } from './tolerance';
import { evaluateWith, openVariants, type Variants } from './variants';
import type { Metrics } from './evaluate';

/**
 * Worst case over the tolerance box. "corners" evaluates every vertex (2ⁿ for n toleranced
 * elements, up to 12). "sensitivity" first moves each element alone to +t to learn which way
 * it pushes each figure, then evaluates, per figure, the two vertices that push it all one way
 * — exact for figures monotonic in each element over the box, the usual case for small
 * tolerances, at n + 2·(figures) evaluations instead of 2ⁿ.
 */
export interface WorstCaseRequest {
	tolerances: ElementTolerance[];
	method: 'corners' | 'sensitivity';
	spec?: SpecLimits;
}

export interface Extreme {
	value: number | null;
	values: Record<string, number>;
}

export interface WorstCaseResult {
	method: 'corners' | 'sensitivity';
	evaluations: number;
	figures: { figure: Figure; nominal: number | null; min: Extreme; max: Extreme }[];
	/** Spec outcome at the worst vertex found for each check; pass only if every vertex passes. */
	spec: (SpecOutcome & { failing: Record<string, number>[] }) | null;
}

export const MAX_CORNER_ELEMENTS = 12;

const active = (ts: ElementTolerance[]) =>
	ts.filter((t) => t.distribution !== 'fixed' && t.tolerance > 0);

function vertex(v: Variants, ts: ElementTolerance[], signs: number[]): Record<string, number> {
	return Object.fromEntries(
		ts.map((t, i) => [
			t.element,
			v.prepared.byId.get(t.element)!.nominal * (1 + signs[i] * t.tolerance)
		])
	);
}

export function worstCase(doc: unknown, req: WorstCaseRequest): WorstCaseResult {
	const v = openVariants(doc);
	checkTolerances(v, req.tolerances);
	const ts = active(req.tolerances);
	const opts = optionsFor(req.spec ?? {});
	const nominal = evaluateWith(v, {}, opts);
	const vertices: number[][] = [];
	if (req.method === 'corners') {
		if (ts.length > MAX_CORNER_ELEMENTS) {
			throw new DesignError(
				'too_many',
				`${ts.length} toleranced elements make ${2 ** ts.length} corners; use the sensitivity-guided search above ${MAX_CORNER_ELEMENTS}`
			);
		}
		for (let mask = 0; mask < 2 ** ts.length; mask++)
			vertices.push(ts.map((_, i) => (mask & (1 << i) ? 1 : -1)));
	} else {
		const base = FIGURES.map((f) => nominal[f]);
		const push = ts.map((_, i) => {
			const m = evaluateWith(
				v,
				vertex(
					v,
					ts,
					ts.map((__, j) => (j === i ? 1 : 0))
				),
				opts
			);
			return FIGURES.map((f, k) => Math.sign((m[f] ?? 0) - (base[k] ?? 0)));
		});
		FIGURES.forEach((_, k) => {
			vertices.push(ts.map((__, i) => push[i][k] || 1));
			vertices.push(ts.map((__, i) => -(push[i][k] || 1)));
		});
	}
	const seen = new Set<string>();
	const evaluated: { values: Record<string, number>; m: Metrics | null }[] = [];
	for (const signs of vertices) {
		const key = signs.join(',');
		if (seen.has(key)) continue;
		seen.add(key);
		const values = vertex(v, ts, signs);
		try {
			evaluated.push({ values, m: evaluateWith(v, values, opts) });
		} catch {
			evaluated.push({ values, m: null });
		}
	}
	const figures = FIGURES.map((f) => {
		let min: Extreme = { value: null, values: {} };
		let max: Extreme = { value: null, values: {} };
		for (const e of evaluated) {
			const x = e.m?.[f] ?? null;
			if (x === null || !Number.isFinite(x)) continue;
			if (min.value === null || x < min.value) min = { value: x, values: e.values };
			if (max.value === null || x > max.value) max = { value: x, values: e.values };
		}
		return { figure: f, nominal: nominal[f], min, max };
	}).filter((f) => f.nominal !== null || f.min.value !== null);
	let spec: WorstCaseResult['spec'] = null;
	// No limits, no verdict: "every vertex meets the limits" would be said of limits nobody set.
	if (req.spec && !isEmptySpec(req.spec)) {
		const outcomes = evaluated.map((e) => ({ e, o: e.m ? checkSpec(req.spec!, e.m) : null }));
		const base = checkSpec(req.spec, nominal);
		const checks = base.checks.map((c) => {
			const bad = outcomes.find(({ o }) => !o || !o.checks.find((x) => x.key === c.key)?.pass);
			return bad ? (bad.o?.checks.find((x) => x.key === c.key) ?? { ...c, pass: false }) : c;
		});
		const failing = outcomes.filter(({ o }) => !o || !o.pass).map(({ e }) => e.values);
		spec = { pass: failing.length === 0, checks, failing: failing.slice(0, 20) };
	}
	return {
		method: req.method,
		evaluations: evaluated.length + 1 + (req.method === 'sensitivity' ? ts.length : 0),
		figures,
		spec
	};
}
