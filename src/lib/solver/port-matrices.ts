import type { DcPorts } from './dc-ports';
import type { Analysis, ResolvedNetwork } from './types';

/**
 * The resistive network seen at the reactive ports (node pairs: parallel capacitors and series
 * inductors are one port each, `members` names their elements), in the zero-value configuration
 * (capacitors open, inductors shorted), and the element matrix.
 *
 * Capacitor rows and columns are driven by a current and read a voltage (ohms). Inductor ports
 * are the dual: driven by a voltage, read the current the network returns (siemens, sign chosen
 * so a passive self-entry is positive). With C = diag(C_k, L_k), the time-constant matrix is
 * T = C·R: diagonal entries are the open-circuit time constants, trace T = b1, and its
 * eigenvalues are −1/p for every finite pole p. Rows/columns of a port with an infinite reading
 * are null.
 */
export function portMatrices(
	net: ResolvedNetwork,
	oc: DcPorts,
	members: string[][]
): Analysis['portMatrices'] {
	const m = oc.m;
	const kinds = oc.elements.map((k) => net.elements[k].type as 'C' | 'L');
	const sign = kinds.map((t) => (t === 'C' ? 1 : -1));
	// Plain loops: this is m² cells of output, built on every analysis.
	const R: (number | null)[][] = new Array(m);
	const C: number[][] = new Array(m);
	for (let i = 0; i < m; i++) {
		const row: (number | null)[] = new Array(m);
		const crow: number[] = new Array(m).fill(0);
		const bad = oc.singular || oc.infinite[i] === 1 || oc.unknown[i] === 1;
		for (let j = 0; j < m; j++) {
			const v = sign[i] * oc.H[i * m + j];
			row[j] = bad || oc.infinite[j] || oc.unknown[j] || !Number.isFinite(v) ? null : v;
		}
		crow[i] = Math.abs(oc.d[i]);
		R[i] = row;
		C[i] = crow;
	}
	return { ports: oc.elements.map((k) => net.elements[k].id), members, kinds, R, C };
}
