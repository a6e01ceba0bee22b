import type { Equations } from './certified-solve';
import { hessenbergRoute, solveByHessenberg, type HessenbergRoute } from './hessenberg-route';
import type { ComplexVector } from './kernels/real-complex-product';
import { modalRoute, solveByModal, type ModalRoute } from './modal-route';

/**
 * Which reduction serves the wide-band points of one system: the modal one where the equations
 * allow it (modal-route.ts: two products a point), else the Hessenberg one (any network). Both
 * certify every answer on the network equations (certified-solve.ts).
 */
export type Reduction = ModalRoute | HessenbergRoute;

/**
 * The reduction at s0, or null when neither applies (G + s0·C singular). `inverse`: (G + s0·C)⁻¹
 * in the original numbering, column-major, when the caller has it (the Hessenberg reduction
 * then needs no factorization); `pos`: the solve's numbering of each original unknown. `only`
 * forces one kind (tests).
 */
export function buildReduction(
	eq: Equations,
	s0: number,
	inverse: Float64Array | null,
	pos: Int32Array,
	only: Reduction['kind'] | null = null
): Reduction | null {
	const modal = only !== 'hessenberg' ? modalRoute(eq, s0) : null;
	if (modal || only === 'modal') return modal;
	return hessenbergRoute(eq, s0, inverse && permutedInverse(inverse, pos));
}

/** x = (G + sC)⁻¹·b and, when asked, y = (G + sC)⁻¹·C·x, certified; false when declined. */
export function solveByReduction(
	eq: Equations,
	route: Reduction,
	sr: number,
	si: number,
	x: ComplexVector,
	y: ComplexVector | null
): boolean {
	return route.kind === 'modal'
		? solveByModal(eq, route, sr, si, x, y)
		: solveByHessenberg(eq, route, sr, si, x, y);
}

/** A column-major inverse in the original numbering, row-major in the solve's numbering. */
function permutedInverse(inv: Float64Array, pos: Int32Array): Float64Array {
	const n = pos.length;
	const out = new Float64Array(n * n);
	for (let c = 0; c < n; c++) {
		const pc = pos[c];
		for (let r = 0; r < n; r++) out[pos[r] * n + pc] = inv[c * n + r];
	}
	return out;
}
