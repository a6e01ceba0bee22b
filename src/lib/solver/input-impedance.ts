import type { DcPorts } from './dc-ports';
import { edgesOnLoops } from './loop-edges';
import { GROUND } from './types';
import { UnionFind } from './union-find';
import type { ResolvedNetwork } from './types';

/**
 * The input functional is the current the V input delivers (Zin = 1/I) or the voltage across
 * the I input (Zin = V). `value` is that functional's reading for a unit input.
 */
export function impedanceFromReading(
	net: ResolvedNetwork,
	re: number,
	im: number
): { re: number; im: number } | null {
	if (net.elements[net.input].type === 'V') {
		const d = re * re + im * im;
		// No current drawn: the source looks into an open circuit.
		if (!(d > 0) || !Number.isFinite(d)) return null;
		const z = { re: re / d, im: -im / d };
		return Number.isFinite(z.re) && Number.isFinite(z.im) ? z : null;
	}
	return Number.isFinite(re) && Number.isFinite(im) ? { re, im } : null;
}

/**
 * Whether the input source carries exactly no current at DC, from the structure: a V input whose
 * branch is a bridge of the graph of every branch that can carry a DC current (all but
 * capacitors and the zeroed independent current sources) closes no loop, so no current flows
 * through it — however the rounding of a solve would have it. Its impedance is infinite (null),
 * not the 1e17 Ω that a round-off current would suggest.
 */
export function drawsNoDcCurrent(net: ResolvedNetwork): boolean {
	const inp = net.elements[net.input];
	if (inp.type !== 'V') return seesNoDcPath(net);
	const edges: [number, number][] = [];
	let mine = -1;
	net.elements.forEach((e, k) => {
		if (e.type === 'C' || e.type === 'I') return;
		if (k === net.input) mine = edges.length;
		edges.push(e.type === 'OPAMP' ? [e.nodes[2], GROUND] : [e.nodes[0], e.nodes[1]]);
	});
	return edgesOnLoops(net.nodeNames.length, edges)[mine] === 0;
}

/**
 * An I input whose terminals no DC path joins (through resistors, inductors, voltage-defined
 * branches; capacitors and current outputs open) sees an infinite resistance: its voltage at DC
 * is unbounded, and the anchored solve of dc-ports.ts would put a finite stand-in there.
 */
function seesNoDcPath(net: ResolvedNetwork): boolean {
	const inp = net.elements[net.input];
	const uf = new UnionFind(net.nodeNames.length);
	net.elements.forEach((e, k) => {
		if (k === net.input || ['C', 'I', 'VCCS', 'CCCS'].includes(e.type)) return;
		uf.union(
			...((e.type === 'OPAMP' ? [e.nodes[2], GROUND] : [e.nodes[0], e.nodes[1]]) as [
				number,
				number
			])
		);
	});
	return !uf.connected(inp.nodes[0], inp.nodes[1]);
}

/** Input impedance at DC from the zero-value (C open, L shorted) configuration. */
export function dcInputImpedance(net: ResolvedNetwork, oc: DcPorts, poleAtZero: boolean) {
	if (oc.singular || poleAtZero || drawsNoDcCurrent(net)) return null;
	// An anchored floating component cannot change what the input sees (no current crosses).
	return impedanceFromReading(net, oc.hz0, 0);
}
