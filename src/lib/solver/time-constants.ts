import { dcPorts, type DcPorts } from './dc-ports';
import { luFactor, luSolve } from './lu';
import { edgesOnLoops } from './loop-edges';
import { branchNodes } from './topology';
import { UnionFind } from './union-find';
import type { ResolvedNetwork, PortReading } from './types';

/** Zero-value configuration: every capacitor open, every inductor shorted; all are ports. */
export function openCircuitPorts(net: ResolvedNetwork): DcPorts {
	return dcPorts(net, (k) => (net.elements[k].type === 'C' ? 'iport' : 'vport'));
}

/** Infinite-value configuration: every capacitor shorted, every inductor open; all are ports. */
export function shortCircuitPorts(net: ResolvedNetwork): DcPorts {
	return dcPorts(net, (k) => (net.elements[k].type === 'C' ? 'vport' : 'iport'));
}

const finite = (x: number) => (Number.isFinite(x) ? x : null);

/**
 * Open-circuit (zero-value) time constants. A capacitor port reads volts per ampere (R seen);
 * an inductor port reads the branch current per volt, which is −1/R seen. With d = C or −L,
 * τ = d·Hkk in both cases, and Σ τ is the trace of the time-constant matrix.
 */
export function openCircuitTimeConstants(net: ResolvedNetwork, oc: DcPorts): PortReading[] {
	return oc.elements.map((k, i) => {
		const e = net.elements[k];
		const hkk = oc.H[i * oc.m + i];
		if (oc.singular || oc.unknown[i]) return { element: e.id, resistance: null, tau: null };
		if (e.type === 'C') {
			return oc.infinite[i]
				? { element: e.id, resistance: null, tau: null }
				: { element: e.id, resistance: hkk, tau: e.value * hkk };
		}
		// Inductor: an infinite reading is an infinite current — zero resistance, infinite τ.
		if (oc.infinite[i]) return { element: e.id, resistance: 0, tau: null };
		return { element: e.id, resistance: finite(-1 / hkk), tau: -e.value * hkk + 0 };
	});
}

/**
 * Short-circuit (infinite-value) time constants: the capacitor port is now a voltage port
 * (reading −1/R), the inductor port a current port (reading R); τ = −d / Kkk in both cases.
 */
export function shortCircuitTimeConstants(net: ResolvedNetwork, sc: DcPorts): PortReading[] {
	return sc.elements.map((k, i) => {
		const e = net.elements[k];
		const kkk = sc.H[i * sc.m + i];
		if (sc.singular || sc.unknown[i]) return { element: e.id, resistance: null, tau: null };
		if (e.type === 'C') {
			if (sc.infinite[i]) return { element: e.id, resistance: 0, tau: 0 };
			const r = finite(-1 / kkk);
			return { element: e.id, resistance: r, tau: r === null ? null : e.value * r };
		}
		if (sc.infinite[i]) return { element: e.id, resistance: null, tau: 0 };
		return { element: e.id, resistance: kkk, tau: finite(e.value / kkk) };
	});
}

/**
 * The infinite-value port matrix from the zero-value one: flipping every port from driven-by-
 * current to driven-by-voltage (and back for inductors) inverts the hybrid matrix, K = −H⁻¹.
 * One m×m factorization instead of a second network of N + m unknowns. Since the network
 * factorizations became banded (lu.ts, band-order.ts) the direct configuration is the cheaper
 * one for generated ladders and meshes (0.9 s against 8 s at m = 1000), so analyze() no longer
 * takes this route; it stays for callers with dense port coupling. It applies only above
 * SC_FROM_OC_ABOVE ports, only when every zero-value
 * reading is finite, and only when H factors with every equilibrated pivot above 1e-6 — so the
 * inversion costs at most about six of the sixteen digits (checked against the direct
 * configuration in the tests).
 */
export const SC_FROM_OC_ABOVE = 20;

export function shortCircuitFromOpen(net: ResolvedNetwork, oc: DcPorts): DcPorts | null {
	const m = oc.m;
	if (m <= SC_FROM_OC_ABOVE || oc.singular || oc.infinite.some((x) => x) || oc.conflicts.length)
		return null;
	if (hasStructuralExtreme(net)) return null;
	const f = luFactor(oc.H, m);
	if (f.pivotRatio < 1e-6) return null;
	const K = new Float64Array(m * m);
	const col = new Float64Array(m);
	for (let j = 0; j < m; j++) {
		col.fill(0);
		col[j] = 1;
		luSolve(f, col);
		for (let i = 0; i < m; i++) K[i * m + j] = -col[i];
	}
	return {
		...oc,
		H: K,
		infinite: new Uint8Array(m),
		singular: false,
		unknown: new Uint8Array(m),
		conflicts: []
	};
}

const VOLTAGE_EDGE = new Set(['V', 'VCVS', 'CCVS', 'OPAMP']);

/**
 * Readings that are exactly 0 or ∞ in the infinite-value configuration (an inductor across a
 * path of shorted capacitors; a capacitor whose terminals only it connects) come out of the
 * inversion as round-off instead, so such networks take the direct, structural route.
 */
export function hasStructuralExtreme(net: ResolvedNetwork): boolean {
	const n = net.nodeNames.length;
	const els = net.elements;
	const shorts = new UnionFind(n);
	for (const e of els)
		if (VOLTAGE_EDGE.has(e.type) || e.type === 'C') shorts.union(...branchNodes(e));
	for (const k of net.reactive) {
		const e = els[k];
		if (e.type === 'L' && shorts.connected(e.nodes[0], e.nodes[1])) return true;
	}
	// A capacitor whose terminals only it connects: a bridge of the graph of R, C and sources.
	const edges: [number, number][] = [];
	const edgeOf = new Map<number, number>();
	els.forEach((e, j) => {
		if (e.type !== 'R' && e.type !== 'C' && !VOLTAGE_EDGE.has(e.type)) return;
		edgeOf.set(j, edges.length);
		edges.push(branchNodes(e));
	});
	const onLoop = edgesOnLoops(n, edges);
	for (const k of net.reactive) if (els[k].type === 'C' && !onLoop[edgeOf.get(k)!]) return true;
	return false;
}
