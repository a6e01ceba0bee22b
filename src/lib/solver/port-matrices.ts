import type { DcPorts } from './dc-ports';
import type { Analysis, ResolvedNetwork } from './types';

/**
 * The resistive network seen at the reactive ports, in the zero-value configuration
 * (capacitors open, inductors shorted), and the element matrix.
 *
 * Capacitor rows and columns are driven by a current and read a voltage (ohms). Inductor ports
 * are the dual: driven by a voltage, read the current the network returns (siemens, sign chosen
 * so a passive self-entry is positive). With C = diag(C_k, L_k), the time-constant matrix is
 * T = C·R: diagonal entries are the open-circuit time constants, trace T = b1, and its
 * eigenvalues are −1/p for every finite pole p. Rows/columns of a port with an infinite reading
 * are null.
 */
export function portMatrices(net: ResolvedNetwork, oc: DcPorts): Analysis['portMatrices'] {
	const m = oc.m;
	const kinds = oc.elements.map((k) => net.elements[k].type as 'C' | 'L');
	const sign = kinds.map((t) => (t === 'C' ? 1 : -1));
	const R = Array.from({ length: m }, (_, i) =>
		Array.from({ length: m }, (_, j) => {
			if (oc.singular || oc.infinite[i] || oc.infinite[j]) return null;
			const v = sign[i] * oc.H[i * m + j];
			return Number.isFinite(v) ? v : null;
		})
	);
	const C = Array.from({ length: m }, (_, i) =>
		Array.from({ length: m }, (_, j) => (i === j ? Math.abs(oc.d[i]) : 0))
	);
	return { ports: oc.elements.map((k) => net.elements[k].id), kinds, R, C };
}
