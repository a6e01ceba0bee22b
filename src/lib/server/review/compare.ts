// Two revisions side by side: which elements were added, removed or changed (old → new), and
// how the analysis moved — every pole and zero before and after, and the headline figures.
import type { NetworkDocument, NetworkElement } from '../../network/schema';
import type { Analysis, Singularity } from '../../solver';
import { ApiProblem } from '../api/respond';
import { analyzeInPool } from '../jobs/analysis-pool';
import { readRevision } from '../sharing/sheet-actions';
import { outputSignature, sameValue, wiring } from './wiring';
import type { Actor } from '../access';
import { figureChange, zeroFloor, type FigureChange } from '../../review/figure-change';
import { compareVariants } from './variant-compare';
import { gainUnit } from '../../review/gain-text';

export interface FieldChange {
	field: 'type' | 'value' | 'nodes' | 'control';
	from: string | null;
	to: string | null;
}

export interface ElementDiff {
	added: { id: string; type: string; value: string | null }[];
	removed: { id: string; type: string; value: string | null }[];
	changed: { id: string; type: string; changes: FieldChange[] }[];
	/** Input source or output node changes, in words. */
	ports: string[];
}

const net = (n: string | number) => (String(n) === '0' ? 'gnd' : String(n));
const val = (e: NetworkElement) => (e.value === undefined ? null : String(e.value));

export function diffElements(a: NetworkDocument, b: NetworkDocument): ElementDiff {
	const before = new Map(a.elements.map((e) => [e.id, e]));
	const after = new Map(b.elements.map((e) => [e.id, e]));
	const out: ElementDiff = { added: [], removed: [], changed: [], ports: [] };
	const both = new Set([...before.keys()].filter((id) => after.has(id)));
	const [wa, wb] = [wiring(a, both), wiring(b, both)];
	for (const [id, e] of after) {
		const old = before.get(id);
		if (!old) {
			out.added.push({ id, type: e.type, value: val(e) });
			continue;
		}
		const changes: FieldChange[] = [];
		if (old.type !== e.type) changes.push({ field: 'type', from: old.type, to: e.type });
		if (!sameValue(old.value, e.value)) changes.push({ field: 'value', from: val(old), to: val(e) });
		// Net names may be regenerated on save: only a change of what the terminals touch counts.
		if (wa.get(id) !== wb.get(id)) changes.push({ field: 'nodes', from: old.nodes.map(net).join(', '), to: e.nodes.map(net).join(', ') });
		if ((old.control ?? null) !== (e.control ?? null)) changes.push({ field: 'control', from: old.control ?? null, to: e.control ?? null });
		if (changes.length) out.changed.push({ id, type: e.type, changes });
	}
	for (const [id, e] of before) if (!after.has(id)) out.removed.push({ id, type: e.type, value: val(e) });
	if (a.input !== b.input) out.ports.push(`input source ${a.input} → ${b.input}`);
	const [oa, ob] = [a, b].map((d) => `${net(d.output.node)} against ${net(d.output.reference ?? 'gnd')}`);
	// Only parts both sides have: removing a load on the output is a removal, not a new output.
	if (outputSignature(a, both) !== outputSignature(b, both)) out.ports.push(`output ${oa} → ${ob}`);
	return out;
}

type Point = Pick<Singularity, 're' | 'im' | 'hz'>;
export interface Movement {
	before: Point | null;
	after: Point | null;
	/** Change of |s| (the natural frequency) in per cent; null when one side is missing or at the origin. */
	movementPct: number | null;
}

const mag = (p: Point) => Math.hypot(p.re, p.im);
const distance = (a: Point, b: Point) => Math.hypot(a.re - b.re, a.im - b.im) / Math.max(mag(a), mag(b), 1e-300);
const point = (p: Point): Point => ({ re: p.re, im: p.im, hz: p.hz });

/** Pair singularities greedily by relative distance: the closest pairs first, the rest unmatched. */
export function matchSingularities(before: Point[], after: Point[]): Movement[] {
	const pairs: [number, number, number][] = [];
	before.forEach((a, i) => after.forEach((b, j) => pairs.push([distance(a, b), i, j])));
	pairs.sort((x, y) => x[0] - y[0]);
	const usedA = new Set<number>();
	const usedB = new Set<number>();
	const out: (Movement & { order: number })[] = [];
	for (const [, i, j] of pairs) {
		if (usedA.has(i) || usedB.has(j)) continue;
		usedA.add(i);
		usedB.add(j);
		const [a, b] = [before[i], after[j]];
		out.push({ before: point(a), after: point(b), movementPct: mag(a) > 0 ? ((mag(b) - mag(a)) / mag(a)) * 100 : null, order: i });
	}
	before.forEach((a, i) => usedA.has(i) || out.push({ before: point(a), after: null, movementPct: null, order: i }));
	after.forEach((b, j) => usedB.has(j) || out.push({ before: null, after: point(b), movementPct: null, order: before.length + j }));
	return out.sort((x, y) => x.order - y.order).map(({ order: _order, ...m }) => m);
}

export interface Figure {
	key: string;
	label: string;
	unit: string;
	before: number | null;
	after: number | null;
	/** Relative change in per cent; null where it means nothing (a side at or near zero, or absent). */
	changePct: number | null;
	/** The change as it should be read: relative, absolute (in `unit`), same, appears, disappears. */
	change: FigureChange;
}


export function figureChanges(a: Analysis | null, b: Analysis | null, gain = 'V/V'): Figure[] {
	const rows: [string, string, string, (x: Analysis) => number | null][] = [
		['dcGain', 'DC gain', gain, (x) => x.dcGain],
		['highFrequencyGain', 'Gain at high frequency', gain, (x) => x.highFrequencyGain],
		['bandwidth', 'Bandwidth (−3 dB)', 'Hz', (x) => x.bandwidth],
		['riseTime', 'Rise time (10–90 %)', 's', (x) => x.step?.riseTime ?? null],
		['overshoot', 'Overshoot', '%', (x) => x.step?.overshoot ?? null], // the solver reports it in per cent already
		['settlingTime', 'Settling time', 's', (x) => x.step?.settlingTime ?? null]
	];
	return rows.map(([key, label, unit, get]) => {
		const before = a ? get(a) : null;
		const after = b ? get(b) : null;
		const change = figureChange(before, after, zeroFloor(unit));
		return { key, label, unit, before, after, changePct: change.kind === 'relative' ? change.pct : null, change };
	});
}

type Side = { ok: true; analysis: Analysis } | { ok: false; error: { error: string; code: string; element?: string; node?: string } };

async function analyzeSide(document: unknown): Promise<Side> {
	const outcome = await analyzeInPool({ document, options: { frequency: { points: 200 }, step: { points: 400 } } });
	return outcome.ok ? { ok: true, analysis: outcome.analysis as Analysis } : outcome;
}

export async function compareRevisions(actor: Actor, sheetId: string, from: number, to: number) {
	if (from === to) throw new ApiProblem(400, 'from and to must be two different revisions.');
	const [a, b] = await Promise.all([readRevision(actor, sheetId, from, 'analyze'), readRevision(actor, sheetId, to, 'analyze')]);
	const [da, db] = [a.revision.document as NetworkDocument, b.revision.document as NetworkDocument];
	const [sa, sb] = await Promise.all([analyzeSide(da), analyzeSide(db)]);
	const [xa, xb] = [sa.ok ? sa.analysis : null, sb.ok ? sb.analysis : null];
	const side = (r: typeof a.revision, s: Side) => ({ number: r.number, createdAt: r.createdAt, message: r.message, error: s.ok ? null : s.error });
	return {
		sheetId,
		from: side(a.revision, sa),
		to: side(b.revision, sb),
		elements: diffElements(da, db),
		poles: xa && xb ? matchSingularities(xa.poles, xb.poles) : [],
		zeros: xa && xb ? matchSingularities(xa.zeros, xb.zeros) : [],
		figures: figureChanges(xa, xb, gainUnit(db)),
		// A sheet with variants: the same, variant by variant (null without variants).
		variants: await compareVariants(da, db)
	};
}
