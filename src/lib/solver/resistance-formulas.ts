import { assemble, dense, type ReactiveMode } from './assemble';
import { luFactor, luSolve, luSolveTransposed } from './lu';
import { SINGULAR_PIVOT } from './port-model';
import { reduceSeriesParallel, termText, termValue, type SpEdge } from './series-parallel';
import { branchNodes } from './topology';
import { UnionFind } from './union-find';
import { GROUND, type PortReading, type ResistanceFormula, type ResolvedNetwork } from './types';

/**
 * The resistance each port sees, written the way a designer reduces it by hand: for each port of
 * a DC configuration (open circuit: capacitors open, inductors shorted; short circuit: the
 * reverse; independent V sources shorted, I sources open), the resistors between the port's
 * terminals reduced in series and parallel, with their names — "Rtop ∥ (Rsrc + Radc)" — and
 * the value of that formula. Where the resistors do not reduce (a bridge) or a controlled source
 * acts on them, the answer says so and names the resistors the value depends on most
 * (normalized sensitivity S = (∂R/∂r)·(r/R), from the adjoint of the port's DC solve).
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

/**
 * Fill the value and the most influential resistors of every port that did not reduce. With the
 * DC equations A·x = e (a unit current into the port) and the port's reading R = eᵀx, the adjoint
 * x̂ = A⁻ᵀe gives every resistor's effect from one factorization: ∂R/∂g = −v·v̂ (v, v̂ the
 * resistor's voltage in both solutions), so S = (∂R/∂r)(r/R) = v·v̂/(r·R). For a network of
 * resistors alone v̂ = v and the S are the resistors' shares of the dissipated power, summing to 1.
 */
function addInfluence(
	net: ResolvedNetwork,
	config: Configuration,
	readings: PortReading[],
	out: ResistanceFormula[]
): void {
	const els = net.elements;
	net.reactive.forEach((port, i) => {
		const f = out[i];
		if (f.kind !== 'not-series-parallel') return;
		f.value = readings[i]?.resistance ?? null;
		if (f.value === null || f.value === 0) return;
		const mode = (k: number): ReactiveMode =>
			k === port ? 'iport' : (els[k].type === 'C') === (config === 'open') ? 'open' : 'short';
		const a = assemble(net, mode);
		anchorFloating(net, a, mode);
		const lu = luFactor(a.g, a.size, true);
		if (lu.pivotRatio < SINGULAR_PIVOT) return;
		const e = dense(a.ports[0].vec, a.size);
		const x = luSolve(lu, e.slice());
		const xh = luSolveTransposed(lu, e.slice());
		const at = (v: Float64Array, n: number) => (n === GROUND ? 0 : v[n]);
		const s: { element: string; sensitivity: number }[] = [];
		els.forEach((r) => {
			if (r.type !== 'R') return;
			const v = at(x, r.nodes[0]) - at(x, r.nodes[1]);
			const vh = at(xh, r.nodes[0]) - at(xh, r.nodes[1]);
			const sk = (v * vh) / (r.value * f.value!);
			if (Number.isFinite(sk) && Math.abs(sk) > 1e-9) s.push({ element: r.id, sensitivity: sk });
		});
		f.influence = s.sort((p, q) => Math.abs(q.sensitivity) - Math.abs(p.sensitivity)).slice(0, TOP);
	});
}

/**
 * A part of the network with no DC path to ground (a node behind open capacitors) would leave A
 * singular; one conductance to ground on one of its nodes fixes its potential and, with no other
 * way out, changes no current — as the time-constant configurations do (dc-ports.ts).
 */
function anchorFloating(
	net: ResolvedNetwork,
	a: ReturnType<typeof assemble>,
	mode: (k: number) => ReactiveMode
): void {
	const n = net.nodeNames.length;
	const uf = new UnionFind(n);
	net.elements.forEach((e, k) => {
		const reactive = e.type === 'C' || e.type === 'L';
		if (reactive && mode(k) !== 'short') return;
		if (e.type === 'I' || e.type === 'VCCS' || e.type === 'CCCS') return;
		const [p, q] = branchNodes(e);
		uf.union(p, q);
	});
	let scale = 0;
	for (let i = 0; i < a.size; i++) scale = Math.max(scale, Math.abs(a.g[i * a.size + i]));
	const done = new Set<number>([uf.groundRoot()]);
	for (let i = 0; i < n; i++) {
		const r = uf.find(i);
		if (done.has(r)) continue;
		done.add(r);
		a.g[i * a.size + i] += scale || 1;
	}
}
