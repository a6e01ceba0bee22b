import type { DcPorts } from './dc-ports';
import { hasStructuralExtreme, SC_FROM_OC_ABOVE } from './time-constants';
import type { ResolvedNetwork, PortReading } from './types';
import { UnionFind } from './union-find';

/**
 * Short-circuit time constants of an RC network straight from the zero-value port matrix.
 *
 * With every port a capacitor, H (volts per ampere between capacitor terminals) is symmetric and
 * positive definite, and the infinite-value readings are the inverse's diagonal: capacitor k,
 * every other shorted, sees R_k = 1 / (H⁻¹)_kk. With H = L·Lᵀ (Cholesky), (H⁻¹)_kk is the squared
 * length of column k of L⁻¹, so the diagonal costs about m³/3 — a sixth of building and solving
 * the network once more with m added branch unknowns, which is what shortCircuitPorts does.
 *
 * Applies only to larger RC networks (above SC_FROM_OC_ABOVE ports) with every zero-value reading
 * finite, no structurally extreme reading, and a factorization whose every pivot keeps at least
 * 1e-4 of its diagonal (so at most about four of the sixteen digits are lost); null otherwise,
 * and the caller takes the direct configuration.
 */
const MIN_PIVOT_SHARE = 1e-4;
const RECIPROCAL = new Set(['R', 'C', 'L', 'V', 'I']);

export function shortCircuitTimeConstantsRC(
	net: ResolvedNetwork,
	oc: DcPorts
): PortReading[] | null {
	const m = oc.m;
	if (m <= SC_FROM_OC_ABOVE || oc.singular || oc.infinite.some((x) => x)) return null;
	if (oc.elements.some((k) => net.elements[k].type !== 'C')) return null;
	// H is symmetric only for a reciprocal network: a controlled source or an op-amp breaks it.
	if (net.elements.some((e) => !RECIPROCAL.has(e.type))) return null;
	if (hasStructuralExtreme(net)) return null;
	// A loop of capacitors (voltage sources count as the shorts they are here) makes H singular
	// — the loop's port voltages sum to zero — so the factorization below would fail halfway.
	if (capacitorLoop(net)) return null;
	const H = oc.H;
	const L = new Float64Array(m * m);
	for (let j = 0; j < m; j++) {
		const rowJ = j * m;
		let d = H[rowJ + j];
		for (let k = 0; k < j; k++) d -= L[rowJ + k] * L[rowJ + k];
		if (!(d > MIN_PIVOT_SHARE * H[rowJ + j])) return null;
		const ljj = Math.sqrt(d);
		L[rowJ + j] = ljj;
		for (let i = j + 1; i < m; i++) {
			const rowI = i * m;
			// Symmetrized, as the pole path does: any asymmetry is factorization round-off.
			let s = 0.5 * (H[rowI + j] + H[rowJ + i]);
			for (let k = 0; k < j; k++) s -= L[rowI + k] * L[rowJ + k];
			L[rowI + j] = s / ljj;
		}
	}
	// Column k of L⁻¹ by forward substitution from row k; its squared length is (H⁻¹)_kk.
	const x = new Float64Array(m);
	return oc.elements.map((k, col) => {
		const e = net.elements[k];
		let sum = 0;
		for (let i = col; i < m; i++) {
			const rowI = i * m;
			let s = i === col ? 1 : 0;
			for (let t = col; t < i; t++) s -= L[rowI + t] * x[t];
			x[i] = s / L[rowI + i];
			sum += x[i] * x[i];
		}
		const r = 1 / sum;
		return { element: e.id, resistance: r, tau: e.value * r };
	});
}

/** Whether some capacitor closes a loop of capacitors and voltage sources (ground included). */
function capacitorLoop(net: ResolvedNetwork): boolean {
	const joined = new UnionFind(net.nodeNames.length);
	for (const e of net.elements) if (e.type === 'V') joined.union(e.nodes[0], e.nodes[1]);
	for (const e of net.elements)
		if (e.type === 'C' && !joined.union(e.nodes[0], e.nodes[1])) return true;
	return false;
}
