import { hessenberg } from './hessenberg';
import { luFactor, luSolve, luSolveTransposed, type RealLU } from './lu';
import { SINGULAR_PIVOT } from './port-model';
import { applySparse, residualWork, type ResidualWork } from './kernels/pencil-residual';
import {
	complexVector,
	realTimesComplex,
	type ComplexVector
} from './kernels/real-complex-product';
import { certify, DERIVATIVE_TOL, plain, type Equations } from './certified-solve';
import {
	shiftedFactor,
	shiftedFactorWorkspace,
	shiftedSolve,
	type ShiftedFactor
} from './kernels/shifted-hessenberg';
import { pinnedRows, type PinnedRows } from './pinned-rows';

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
 * Every answer is certified on the network equations and refined (certified-solve.ts).
 */

export interface HessenbergRoute {
	kind: 'hessenberg';
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
	w: ComplexVector;
	v: ComplexVector;
	u: ComplexVector;
	c: ComplexVector;
	cAbs: Float64Array;
	zero: Float64Array;
}

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
		kind: 'hessenberg',
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
		w: complexVector(n),
		v: complexVector(n),
		u: complexVector(n),
		c: complexVector(n),
		cAbs: new Float64Array(n),
		zero: new Float64Array(n)
	};
}

/**
 * x = (G + sC)⁻¹·b and, when asked, y = (G + sC)⁻¹·C·x (so dx/ds = −y), both certified; false
 * when either is not (the caller falls back to LU). x and y are the caller's work vectors.
 */
export function solveByHessenberg(
	eq: Equations,
	h: HessenbergRoute,
	sr: number,
	si: number,
	x: ComplexVector,
	y: ComplexVector | null
): boolean {
	const { n, f, w, v, t } = h;
	// A pivot below 1e-13 of its row (the pivot-ratio test of lu.ts): singular to working
	// precision here; the LU decides what to answer.
	if (!shiftedFactor(f, t, sr - h.s0, si, 1e-13)) return false;
	w.re.set(h.z0);
	w.im.fill(0);
	shiftedSolve(f, w.re, w.im);
	realTimesComplex(h.bq, w, x, n, false);
	const correct = (r: ComplexVector, into: ComplexVector) => {
		realTimesComplex(h.p, r, h.u, n, false);
		shiftedSolve(f, h.u.re, h.u.im);
		realTimesComplex(h.bq, h.u, into, n, true);
	};
	if (!certify(eq, h, sr, si, x, { re: h.bd, im: h.zero }, h.bAbs, correct) || !plain(x))
		return false;
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
	realTimesComplex(h.bq, v, y, n, false);
	applySparse(eq.cap, x.re, x.im, h.c.re, h.c.im, h.cAbs);
	return (
		certify(eq, h, sr, si, y, h.c, h.cAbs, correct, DERIVATIVE_TOL, DERIVATIVE_TOL) && plain(y)
	);
}
