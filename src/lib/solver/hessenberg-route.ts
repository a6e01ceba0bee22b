import { hessenberg } from './hessenberg';
import { luFactor, luSolve, luSolveTransposed, type RealLU } from './lu';
import { SINGULAR_PIVOT } from './port-model';
import {
	applySparse,
	pencilResidual,
	residualWork,
	type ResidualWork,
	type Triplets
} from './kernels/pencil-residual';
import {
	shiftedFactor,
	shiftedFactorWorkspace,
	shiftedSolve,
	type ShiftedFactor
} from './kernels/shifted-hessenberg';
import { pinnedRows, pinUnknowns, type PinnedRows } from './pinned-rows';

/**
 * The network equations (G + sC)·x = b at many s from one reduction (Laub, "Efficient
 * multivariable frequency response computations", IEEE Trans. Autom. Control 26(2), 1981),
 * for networks whose matrix has no narrow band (a mesh with long-range couplings), where a
 * banded LU costs O(n³) per point. With a real shift s0 (the analysis' own, where G + s0·C is
 * regular) and σ = s − s0:
 *
 *     G + sC = (G + s0·C)·(I + σK),  K = (G + s0·C)⁻¹·C = B·Q·T·Qᵀ·B⁻¹
 *
 * with B a balancing scale and T upper Hessenberg (hessenberg.ts), computed once (O(n³)). Then
 * x = B·Q·(I + σT)⁻¹·P·b with P = Qᵀ·B⁻¹·(G + s0·C)⁻¹ is an O(n²) Hessenberg solve
 * (kernels/shifted-hessenberg.ts) and two products, and dx/ds = −(G + sC)⁻¹·C·x =
 * −B·Q·(I + σT)⁻¹·T·w with the same factors.
 *
 * The reduction is backward stable only relative to ‖K‖, so a small entry of x (the response
 * deep in a stop band) can come out with few correct digits. Every solution is therefore
 * checked on the network equations themselves by its componentwise backward error ω
 * (kernels/pencil-residual.ts) and refined (iterative refinement with the residual in working
 * precision: Skeel, Math. Comp. 35, 1980; Higham, "Accuracy and Stability of Numerical
 * Algorithms", 2nd ed., SIAM 2002, ch. 12) down to the rounding floor of the residual (4ε),
 * at most three times, each step halving ω. Accepted when ω ≤ 64ε: the answer is then the
 * exact response of the network with every conductance, capacitance and source entry changed
 * by at most that relative amount. Otherwise the point is not answered here: the caller solves
 * it by LU.
 */
export const BACKWARD_TOL = 64 * Number.EPSILON;
/** Refinement goes on to the residual's own rounding floor, as LAPACK's does: beside a pole
 *  (the zero checks probe there) every digit of ω counts. */
const REFINE_TARGET = 4 * Number.EPSILON;
const MAX_REFINE = 3;
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

interface Vec {
	re: Float64Array;
	im: Float64Array;
}

export interface HessenbergRoute {
	n: number;
	s0: number;
	t: Float64Array;
	/** B·Q and P = Qᵀ·B⁻¹·(G + s0·C)⁻¹, row-major. */
	bq: Float64Array;
	p: Float64Array;
	/** P·b, b dense, |b|. */
	z0: Float64Array;
	bd: Float64Array;
	bAbs: Float64Array;
	pinned: PinnedRows;
	f: ShiftedFactor;
	res: ResidualWork;
	/** Work: reduced vectors w, v, u; the derivative's right-hand side C·x, |C|·|x|. */
	w: Vec;
	v: Vec;
	u: Vec;
	c: Vec;
	cAbs: Float64Array;
	zero: Float64Array;
}

const vec = (n: number): Vec => ({ re: new Float64Array(n), im: new Float64Array(n) });

/**
 * Builds the reduction at s0; null when G + s0·C is (nearly) singular. `inverse`: (G + s0·C)⁻¹,
 * row-major in this numbering, when the caller has already formed it (the port model does when
 * there are more ports than unknowns): then K is read off it column by column of C and P is one
 * product, with no factorization and no solves here.
 */
export function hessenbergRoute(
	eq: Equations,
	s0: number,
	inverse: Float64Array | null = null
): HessenbergRoute | null {
	const { n, g, cap } = eq;
	let lu: RealLU | null = null;
	if (!inverse) {
		const a0 = new Float64Array(n * n);
		for (let k = 0; k < g.v.length; k++) a0[g.r[k] * n + g.c[k]] += g.v[k];
		for (let k = 0; k < cap.v.length; k++) a0[cap.r[k] * n + cap.c[k]] += s0 * cap.v[k];
		lu = luFactor(a0, n, true);
		if (!(lu.pivotRatio >= SINGULAR_PIVOT)) return null;
	}
	// K = (G + s0·C)⁻¹·C, one solve (or one combination of the inverse's columns) per column
	// of C that has an entry.
	const cols: number[][] = Array.from({ length: n }, () => []);
	for (let k = 0; k < cap.v.length; k++) cols[cap.c[k]].push(k);
	const kmat = new Float64Array(n * n);
	const col = new Float64Array(n);
	for (let j = 0; j < n; j++) {
		if (cols[j].length === 0) continue;
		col.fill(0);
		if (lu) {
			for (const k of cols[j]) col[cap.r[k]] += cap.v[k];
			luSolve(lu, col);
		} else
			for (const k of cols[j]) {
				const v = cap.v[k];
				const c = cap.r[k];
				for (let i = 0; i < n; i++) col[i] += v * inverse![i * n + c];
			}
		for (let i = 0; i < n; i++) kmat[i * n + j] = col[i];
	}
	for (let i = 0; i < kmat.length; i++) if (!Number.isFinite(kmat[i])) return null;
	const { h: t, q, scale } = hessenberg(kmat, n, true);
	const bq = new Float64Array(n * n);
	for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) bq[i * n + j] = scale[i] * q[i * n + j];
	// Row j of P solves (G + s0·C)ᵀ·p = B⁻¹·(column j of Q): pⱼ = Σᵣ (qᵣⱼ/bᵣ)·(row r of A⁻¹).
	const p = new Float64Array(n * n);
	for (let j = 0; j < n; j++) {
		for (let i = 0; i < n; i++) col[i] = q[i * n + j] / scale[i];
		if (lu) {
			luSolveTransposed(lu, col);
			p.set(col, j * n);
		} else {
			const row = j * n;
			for (let r = 0; r < n; r++) {
				const f = col[r];
				if (f === 0) continue;
				const src = r * n;
				for (let i = 0; i < n; i++) p[row + i] += f * inverse![src + i];
			}
		}
	}
	for (let i = 0; i < p.length; i++) if (!Number.isFinite(p[i])) return null;
	const bd = new Float64Array(n);
	for (let k = 0; k < eq.b.idx.length; k++) bd[eq.b.idx[k]] += eq.b.val[k];
	const z0 = new Float64Array(n);
	for (let j = 0; j < n; j++) {
		let s = 0;
		for (let i = 0; i < n; i++) s += p[j * n + i] * bd[i];
		z0[j] = s;
	}
	return {
		n,
		s0,
		t,
		bq,
		p,
		z0,
		bd,
		bAbs: bd.map(Math.abs),
		pinned: pinnedRows(eq.n, g, cap),
		f: shiftedFactorWorkspace(n),
		res: residualWork(n),
		w: vec(n),
		v: vec(n),
		u: vec(n),
		c: vec(n),
		cAbs: new Float64Array(n),
		zero: new Float64Array(n)
	};
}

/**
 * out = M·x for a row-major n×n real M and complex x; `add` accumulates. Two rows per pass so
 * each x entry is loaded once for both (1.7× faster in V8 at n = 152; every row's sum keeps
 * its order, so the result is bit for bit the one-row loop's).
 */
function mulInto(m: Float64Array, x: Vec, out: Vec, n: number, add: boolean): void {
	const { re: xr, im: xi } = x;
	const { re: or, im: oi } = out;
	let i = 0;
	for (; i + 1 < n; i += 2) {
		const r0 = i * n;
		const r1 = r0 + n;
		let a0 = 0;
		let b0 = 0;
		let a1 = 0;
		let b1 = 0;
		for (let j = 0; j < n; j++) {
			const u = xr[j];
			const v = xi[j];
			const p = m[r0 + j];
			const q = m[r1 + j];
			a0 += p * u;
			b0 += p * v;
			a1 += q * u;
			b1 += q * v;
		}
		if (add) {
			or[i] += a0;
			oi[i] += b0;
			or[i + 1] += a1;
			oi[i + 1] += b1;
		} else {
			or[i] = a0;
			oi[i] = b0;
			or[i + 1] = a1;
			oi[i + 1] = b1;
		}
	}
	for (; i < n; i++) {
		const row = i * n;
		let sr = 0;
		let si = 0;
		for (let j = 0; j < n; j++) {
			sr += m[row + j] * xr[j];
			si += m[row + j] * xi[j];
		}
		if (add) {
			or[i] += sr;
			oi[i] += si;
		} else {
			or[i] = sr;
			oi[i] = si;
		}
	}
}

/**
 * Refines x against rhs as described at the top; true when ω ends at most BACKWARD_TOL.
 */
function certify(
	eq: Equations,
	h: HessenbergRoute,
	sr: number,
	si: number,
	x: Vec,
	rhs: Vec,
	rhsAbs: Float64Array,
	target = REFINE_TARGET,
	accept = BACKWARD_TOL
): boolean {
	const { res, u, n } = h;
	const r = { re: res.rr, im: res.ri };
	pinUnknowns(h.pinned, sr, si, x, rhs);
	let omega = pencilResidual(eq.g, eq.cap, sr, si, x.re, x.im, rhs.re, rhs.im, rhsAbs, res);
	for (let k = 0; k < MAX_REFINE && omega > target; k++) {
		if (!Number.isFinite(omega)) return false;
		mulInto(h.p, r, u, n, false);
		shiftedSolve(h.f, u.re, u.im);
		mulInto(h.bq, u, x, n, true);
		pinUnknowns(h.pinned, sr, si, x, rhs);
		const next = pencilResidual(eq.g, eq.cap, sr, si, x.re, x.im, rhs.re, rhs.im, rhsAbs, res);
		if (!(next <= omega / 2)) return Math.min(omega, next) <= accept;
		omega = next;
	}
	return omega <= accept;
}

/** Outside this range the banded LU's wide numbers are needed (direct-solve.ts). */
const plain = (x: Vec) => {
	for (let i = 0; i < x.re.length; i++) {
		const m = Math.abs(x.re[i]) + Math.abs(x.im[i]);
		if (m !== 0 && !(m > 1e-280 && m < 1e280)) return false;
	}
	return true;
};

/**
 * x = (G + sC)⁻¹·b and, when asked, y = (G + sC)⁻¹·C·x (so dx/ds = −y), both certified; false
 * when either is not (the caller falls back to LU). x and y are the caller's work vectors.
 */
export function solveByHessenberg(
	eq: Equations,
	h: HessenbergRoute,
	sr: number,
	si: number,
	x: Vec,
	y: Vec | null
): boolean {
	const { n, f, w, v, t } = h;
	// A pivot below 1e-13 of its row (the pivot-ratio test of lu.ts): singular to working
	// precision here; the LU decides what to answer.
	if (!shiftedFactor(f, t, sr - h.s0, si, 1e-13)) return false;
	w.re.set(h.z0);
	w.im.fill(0);
	shiftedSolve(f, w.re, w.im);
	mulInto(h.bq, w, x, n, false);
	if (!certify(eq, h, sr, si, x, { re: h.bd, im: h.zero }, h.bAbs) || !plain(x)) return false;
	if (!y) return true;
	// First guess (I + σT)⁻¹·T·w with w from before the refinement; the check corrects the rest.
	for (let i = 0; i < n; i++) {
		const row = i * n;
		let sr2 = 0;
		let si2 = 0;
		for (let j = i === 0 ? 0 : i - 1; j < n; j++) {
			sr2 += t[row + j] * w.re[j];
			si2 += t[row + j] * w.im[j];
		}
		v.re[i] = sr2;
		v.im[i] = si2;
	}
	shiftedSolve(f, v.re, v.im);
	mulInto(h.bq, v, y, n, false);
	applySparse(eq.cap, x.re, x.im, h.c.re, h.c.im, h.cAbs);
	return certify(eq, h, sr, si, y, h.c, h.cAbs, DERIVATIVE_TOL, DERIVATIVE_TOL) && plain(y);
}
