import { assemble, type Assembled } from '../solver/assemble';
import { validateNetwork } from '../solver/validate';
import type { ResolvedNetwork } from '../solver/types';
import { DesignError } from './errors';

/**
 * A network validated and assembled once, whose element values can then be changed in place:
 * every design aid (sweep, solve, sensitivity, tolerance runs) evaluates hundreds or thousands
 * of variants of one structure, and re-parsing plus re-assembling each would cost more than the
 * eigen-solve itself on small sheets. The MNA matrix is affine in one parameter per element
 * (θ = 1/R for a resistor, the value itself for a controlled source), so a change is
 * G = G_nominal + Σ (θ − θ_nominal)·S_k with S_k the element's fixed stamp; C and L live in the
 * port list (d = C or −L) and are simply overwritten.
 */
export type Stamp = { at: number; coef: number }[];

export interface PreparedElement {
	index: number;
	id: string;
	type: string;
	nominal: number;
	/** 'conductance': θ = 1/value; 'linear': θ = value; 'port': a C or L in the port list. */
	kind: 'conductance' | 'linear' | 'port';
	/** Entries of ∂G/∂θ (flat row-major positions), for kinds conductance and linear. */
	stamp: Stamp;
	/** Index into `assembled.ports` for kind port. */
	port: number;
}

export interface Prepared {
	net: ResolvedNetwork;
	assembled: Assembled;
	nominalG: Float64Array;
	/** Adjustable elements (R, C, L and the four controlled sources) by id. */
	byId: Map<string, PreparedElement>;
	elements: PreparedElement[];
	/** The values now in `assembled` (index: network element). */
	current: Float64Array;
}

const ADJUSTABLE = new Set(['R', 'C', 'L', 'VCCS', 'VCVS', 'CCCS', 'CCVS']);

export function prepareNetwork(doc: unknown): Prepared {
	const net = structuredCloneNetwork(validateNetwork(doc));
	const assembled = assemble(net, () => 'pencil');
	const n = assembled.size;
	const elements: PreparedElement[] = [];
	const portOf = new Map(assembled.ports.map((p, i) => [p.element, i]));
	net.elements.forEach((e, k) => {
		if (!ADJUSTABLE.has(e.type)) return;
		const base = { index: k, id: e.id, type: e.type, nominal: e.value, port: -1 };
		if (e.type === 'C' || e.type === 'L') {
			elements.push({ ...base, kind: 'port', stamp: [], port: portOf.get(k)! });
		} else if (e.type === 'R') {
			const [a, b] = e.nodes;
			const stamp: Stamp = [];
			const put = (r: number, c: number, v: number) => {
				if (r >= 0 && c >= 0) stamp.push({ at: r * n + c, coef: v });
			};
			put(a, a, 1);
			put(b, b, 1);
			put(a, b, -1);
			put(b, a, -1);
			elements.push({ ...base, kind: 'conductance', stamp });
		} else {
			elements.push({ ...base, kind: 'linear', stamp: differenceStamp(net, k, assembled) });
		}
	});
	return {
		net,
		assembled,
		nominalG: assembled.g.slice(),
		byId: new Map(elements.map((e) => [e.id, e])),
		elements,
		current: Float64Array.from(net.elements.map((e) => e.value))
	};
}

/**
 * The stamp of a controlled source from two assemblies (its value +1 against nominal): their
 * branch rows depend on the solver's numbering, which this way is never duplicated here. Only
 * controlled sources take this path, and a sheet has few of them.
 */
function differenceStamp(net: ResolvedNetwork, k: number, a: Assembled): Stamp {
	const bumped = {
		...net,
		elements: net.elements.map((e, i) => (i === k ? { ...e, value: e.value + 1 } : e))
	};
	const b = assemble(bumped, () => 'pencil');
	const stamp: Stamp = [];
	for (let i = 0; i < a.g.length; i++) {
		const d = b.g[i] - a.g[i];
		if (d !== 0) stamp.push({ at: i, coef: d });
	}
	return stamp;
}

function structuredCloneNetwork(net: ResolvedNetwork): ResolvedNetwork {
	return { ...net, elements: net.elements.map((e) => ({ ...e, nodes: e.nodes.slice() })) };
}

export function elementOf(p: Prepared, id: string): PreparedElement {
	const e = p.byId.get(id);
	if (!e) {
		const known = p.net.elements.some((x) => x.id === id);
		throw new DesignError(
			known ? 'not_adjustable' : 'unknown_element',
			known
				? `element "${id}" has no value to adjust (sources and op-amps are fixed)`
				: `element "${id}" is not in the network`,
			{ element: id }
		);
	}
	return e;
}

const theta = (e: PreparedElement, v: number) => (e.kind === 'conductance' ? 1 / v : v);

/**
 * Set element values (by network element index) and leave every other element at its nominal
 * value. The G matrix is rebuilt from the nominal copy each call, so thousands of runs never
 * accumulate rounding drift.
 */
export function applyValues(
	p: Prepared,
	values: Map<number, number> | ((e: PreparedElement) => number)
): void {
	const g = p.assembled.g;
	g.set(p.nominalG);
	for (const e of p.elements) {
		const v = typeof values === 'function' ? values(e) : (values.get(e.index) ?? e.nominal);
		if (!Number.isFinite(v) || (v === 0 && e.kind !== 'linear')) {
			throw new DesignError('bad_value', `element "${e.id}": value ${v} cannot be analyzed`, {
				element: e.id
			});
		}
		p.current[e.index] = v;
		p.net.elements[e.index].value = v;
		if (e.kind === 'port') {
			p.assembled.ports[e.port].d = e.type === 'C' ? v : -v;
			continue;
		}
		if (v === e.nominal) continue;
		const dt = theta(e, v) - theta(e, e.nominal);
		for (const s of e.stamp) g[s.at] += dt * s.coef;
	}
}

export function resetValues(p: Prepared): void {
	applyValues(p, new Map());
}

/** The document with the given values written in (numbers in SI base units). */
export function documentWith(
	doc: { elements: { id: string; value?: unknown }[] },
	values: Record<string, number>
) {
	return {
		...doc,
		elements: doc.elements.map((e) => (e.id in values ? { ...e, value: values[e.id] } : e))
	};
}
