import { pencilResidual, type ResidualWork, type Triplets } from './kernels/pencil-residual';
import type { ComplexVector } from './kernels/real-complex-product';
import { pinUnknowns, type PinnedRows } from './pinned-rows';

/**
 * The certificate every answer of a reduced route (hessenberg-route.ts, modal-route.ts) must
 * earn before it is used. A reduction is backward stable only relative to its own norms, so a
 * small entry of x (the response deep in a stop band) can come out with few correct digits.
 * Every solution is therefore checked on the network equations themselves by its
 * componentwise backward error ω (kernels/pencil-residual.ts) and refined (iterative
 * refinement with the residual in working precision: Skeel, Math. Comp. 35, 1980; Higham,
 * "Accuracy and Stability of Numerical Algorithms", 2nd ed., SIAM 2002, ch. 12) down to the
 * rounding floor of the residual (4ε), at most three times, each step halving ω. Accepted when
 * ω ≤ 64ε: the answer is then the exact response of the network with every conductance,
 * capacitance and source entry changed by at most that relative amount. Otherwise the point is
 * not answered by the route: the caller solves it by LU.
 */
export const BACKWARD_TOL = 64 * Number.EPSILON;
/** Refinement goes on to the residual's own rounding floor, as LAPACK's does: beside a pole
 *  (the zero checks probe there) every digit of ω counts. */
export const REFINE_TARGET = 4 * Number.EPSILON;
export const MAX_REFINE = 3;
/**
 * The derivative y = (G + sC)⁻¹·C·x only feeds the group delay, Newton steps on zeros and the
 * slope read far above every pole, none of which needs the last digits (the banded LU leaves
 * it unrefined): it is accepted, and refined only down to, a componentwise backward error of
 * 1e-12. On the 300-capacitor mesh that spares three refinements in four (each two dense
 * products and a solve); the group delay still agrees with the banded LU's to 1e-9
 * (hessenberg-route.test.ts).
 */
export const DERIVATIVE_TOL = 1e-12;

/** The parts of the network equations the route reads (direct-solve.ts's DirectSystem). */
export interface Equations {
	n: number;
	g: Triplets;
	cap: Triplets;
	b: { idx: Int32Array; val: Float64Array };
}

/** What a route lends the certificate: its residual work and the unknowns pinned by a row. */
export interface CertifyWork {
	res: ResidualWork;
	pinned: PinnedRows;
}

/**
 * Refines x against rhs as described above, `correct(r, x)` adding the route's approximate
 * solution of (G + sC)·u = r to x; true when ω ends at most `accept`.
 */
export function certify(
	eq: Equations,
	work: CertifyWork,
	sr: number,
	si: number,
	x: ComplexVector,
	rhs: ComplexVector,
	rhsAbs: Float64Array,
	correct: (r: ComplexVector, x: ComplexVector) => void,
	target = REFINE_TARGET,
	accept = BACKWARD_TOL
): boolean {
	const { res } = work;
	const r = { re: res.rr, im: res.ri };
	pinUnknowns(work.pinned, sr, si, x, rhs);
	let omega = pencilResidual(eq.g, eq.cap, sr, si, x.re, x.im, rhs.re, rhs.im, rhsAbs, res);
	for (let k = 0; k < MAX_REFINE && omega > target; k++) {
		if (!Number.isFinite(omega)) return false;
		correct(r, x);
		pinUnknowns(work.pinned, sr, si, x, rhs);
		const next = pencilResidual(eq.g, eq.cap, sr, si, x.re, x.im, rhs.re, rhs.im, rhsAbs, res);
		if (!(next <= omega / 2)) return Math.min(omega, next) <= accept;
		omega = next;
	}
	return omega <= accept;
}

/** Outside this range the banded LU's wide numbers are needed (direct-solve.ts). */
export const plain = (x: ComplexVector) => {
	for (let i = 0; i < x.re.length; i++) {
		const m = Math.abs(x.re[i]) + Math.abs(x.im[i]);
		if (m !== 0 && !(m > 1e-280 && m < 1e280)) return false;
	}
	return true;
};
