import { dcPorts } from './dc-ports';
import { reduceSeriesParallel, termText, termValue, type SpEdge } from './series-parallel';
import { openCircuitTimeConstants, shortCircuitTimeConstants } from './time-constants';
import { branchNodes } from './topology';
import { UnionFind } from './union-find';
import type { PortReading, ResistanceFormula, ResolvedNetwork } from './types';

/**
 * The resistance each port sees, written the way a designer reduces it by hand: for each port of
 * a DC configuration (open circuit: capacitors open, inductors shorted; short circuit: the
 * reverse; independent V sources shorted, I sources open), the resistors between the port's
 * terminals reduced in series and parallel, with their names — "Rtop ∥ (Rsrc + Radc)" — and
 * the value of that formula. Where the resistors do not reduce (a bridge) or a controlled source
 * acts on them, the answer says so and names the resistors the value depends on most
 * (normalized sensitivity S = (∂R/∂r)·(r/R), by central differences of the solver's reading).
 * Runs on the port network (reactive-ports.ts), so parallel capacitors are one port.
 */
export type Configuration = 'open' | 'short';

const CONTROLLED = new Set(['VCVS', 'VCCS', 'CCVS', 'CCCS', 'OPAMP']);
/**
 * Formulas are for people: above these sizes (an imported line of thousands of sections) no one
 * reads them, and the per-port reduction would cost more than the analysis.
 */
export const FORMULA_PORT_LIMIT = 200;
export const FORMULA_WORK_LIMIT = 80_000; // ports × resistors
/** Resistors whose influence is computed at most (two DC solves each). */
export const INFLUENCE_LIMIT = 40;
const TOP = 3;

export function resistanceFormulas(
	net: ResolvedNetwork,
	config: Configuration,
	readings: PortReading[]
): ResistanceFormula[] {
	const els = net.elements;
	const n = net.nodeNames.length;
	const shortedInConfig = (k: number) => (els[k].type === 'L') === (config === 'open');
	const resistorCount = els.filter((e) => e.type === 'R').length;
	const m = net.reactive.length;
	if (m > FORMULA_PORT_LIMIT || m * resistorCount > FORMULA_WORK_LIMIT) {
		const reason = `not computed for networks this large (${m} ports, ${resistorCount} resistors)`;
		return readings.map((r) => ({
			kind: 'not-computed',
			formula: null,
			value: r.resistance,
			reason,
			influence: []
		}));
	}
	const out = net.reactive.map((port): ResistanceFormula => {
		// Shorts: V sources and the other reactive ports this configuration shorts.
		const uf = new UnionFind(n);
		for (const e of els) if (e.type === 'V') uf.union(e.nodes[0], e.nodes[1]);
		for (const k of net.reactive)
			if (k !== port && shortedInConfig(k)) uf.union(els[k].nodes[0], els[k].nodes[1]);
		const [a, b] = [uf.find(els[port].nodes[0]), uf.find(els[port].nodes[1])];
		const edges: SpEdge[] = [];
		els.forEach((e) => {
			if (e.type !== 'R') return;
			edges.push({
				a: uf.find(e.nodes[0]),
				b: uf.find(e.nodes[1]),
				term: { kind: 'leaf', name: e.id, value: e.value }
			});
		});
		const actor = controlledSourceOn(net, uf, edges, a, b);
		if (actor) return notSeriesParallel(`controlled source ${actor} acts on it`);
		const r = reduceSeriesParallel(edges, a, b);
		if (r.kind === 'series-parallel')
			return {
				kind: r.kind,
				formula: termText(r.term),
				value: finite(termValue(r.term)),
				reason: null,
				influence: []
			};
		if (r.kind === 'open')
			return {
				kind: 'open',
				formula: null,
				value: null,
				reason: 'no DC path between its terminals',
				influence: []
			};
		if (r.kind === 'short')
			return {
				kind: 'short',
				formula: null,
				value: 0,
				reason: 'its terminals are shorted (sources at zero, ports shorted)',
				influence: []
			};
		return notSeriesParallel('the resistors form a bridge (no series or parallel pair is left)');
	});
	addInfluence(net, config, readings, out);
	return out;
}

const finite = (x: number) => (Number.isFinite(x) ? x : null);

function notSeriesParallel(reason: string): ResistanceFormula {
	return { kind: 'not-series-parallel', formula: null, value: null, reason, influence: [] };
}

/** The first controlled source or op-amp with any terminal in the part of the network the port sees. */
function controlledSourceOn(
	net: ResolvedNetwork,
	uf: UnionFind,
	edges: SpEdge[],
	a: number,
	b: number
): string | null {
	const comp = new UnionFind(net.nodeNames.length);
	const slot = (root: number) => (root === net.nodeNames.length ? -1 : root);
	for (const e of edges) comp.union(slot(e.a), slot(e.b));
	const controlled = net.elements.filter((e) => CONTROLLED.has(e.type));
	for (const e of controlled) {
		const [p, q] = branchNodes(e);
		comp.union(slot(uf.find(p)), slot(uf.find(q)));
	}
	const touches = (node: number) => {
		const r = comp.find(slot(uf.find(node)));
		return r === comp.find(slot(a)) || r === comp.find(slot(b));
	};
	for (const e of controlled) {
		const nodes =
			e.type === 'CCCS' || e.type === 'CCVS'
				? [...e.nodes, ...net.elements[e.control].nodes]
				: e.nodes;
		if (nodes.some(touches)) return e.id;
	}
	return null;
}

/** Fill the value and the most influential resistors of every port that did not reduce. */
function addInfluence(
	net: ResolvedNetwork,
	config: Configuration,
	readings: PortReading[],
	out: ResistanceFormula[]
): void {
	const open = out.map((f, i) => (f.kind === 'not-series-parallel' ? i : -1)).filter((i) => i >= 0);
	if (open.length === 0) return;
	for (const i of open) out[i].value = readings[i]?.resistance ?? null;
	const resistors = net.elements.flatMap((e, k) => (e.type === 'R' ? [k] : []));
	if (resistors.length > INFLUENCE_LIMIT) {
		for (const i of open)
			out[i].reason += ` (influence not computed above ${INFLUENCE_LIMIT} resistors)`;
		return;
	}
	const H = 1e-5;
	const read = (k: number, factor: number) => {
		const els = net.elements.map((e, j) => (j === k ? { ...e, value: e.value * factor } : e));
		const varied = { ...net, elements: els };
		return config === 'open'
			? openCircuitTimeConstants(
					varied,
					dcPorts(varied, (j) => (els[j].type === 'C' ? 'iport' : 'vport'))
				)
			: shortCircuitTimeConstants(
					varied,
					dcPorts(varied, (j) => (els[j].type === 'C' ? 'vport' : 'iport'))
				);
	};
	const sens: { element: string; s: number }[][] = open.map(() => []);
	for (const k of resistors) {
		const up = read(k, 1 + H);
		const down = read(k, 1 - H);
		open.forEach((i, j) => {
			const r0 = readings[i]?.resistance;
			const ru = up[i]?.resistance;
			const rd = down[i]?.resistance;
			if (r0 == null || ru == null || rd == null || r0 === 0) return;
			const s = (ru - rd) / (2 * H * r0);
			if (Number.isFinite(s) && Math.abs(s) > 1e-9)
				sens[j].push({ element: net.elements[k].id, s });
		});
	}
	open.forEach((i, j) => {
		out[i].influence = sens[j]
			.sort((x, y) => Math.abs(y.s) - Math.abs(x.s))
			.slice(0, TOP)
			.map((x) => ({ element: x.element, sensitivity: x.s }));
	});
}
