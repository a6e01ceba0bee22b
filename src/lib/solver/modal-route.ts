import { symmetricEigen } from './symmetric-eigen';
import { applySparse, residualWork, type ResidualWork } from './kernels/pencil-residual';
import {
	complexVector,
	realTimesComplex,
	type ComplexVector
} from './kernels/real-complex-product';
import { certify, DERIVATIVE_TOL, plain, type Equations } from './certified-solve';
import { pinnedRows, type PinnedRows } from './pinned-rows';
import {
	cholesky,
	isSymmetric,
	lowerSolveRows,
	lowerTransposedSolveRows,
	transpose
} from './kernels/dense-cholesky';

/**
 * The network equations (G + sC)·x = b at many s for a reciprocal network whose equations,
 * once the unknowns fixed by a single row are set aside, are symmetric with G + s0·C positive
 * definite (an RC network driven by grounded sources). On those free unknowns, with σ = s − s0,
 *
 *     G + sC = A0·(I + σK),  A0 = G + s0·C = L·Lᵀ,  K = A0⁻¹·C,
 *
 * and K is self-adjoint in the A0 inner product: L⁻¹·C·L⁻ᵀ = U·Λ·Uᵀ (symmetric-eigen.ts) gives
 * X = L⁻ᵀ·U with Xᵀ·A0·X = I and K = X·Λ·X⁻¹, so
 *
 *     (G + sC)⁻¹ = X·(I + σΛ)⁻¹·Xᵀ
 *
 * (the symmetric definite generalized eigenproblem: Golub and Van Loan, "Matrix Computations",
 * 4th ed., §8.7). Each point is then two dense products and a diagonal scaling — no
 * factorization and no substitution, where the Hessenberg route (hessenberg-route.ts) pays an
 * O(n²) elimination and two to four substitutions. Unknowns set aside: those pinned by a row
 * with one entry (a node held by a source) are set from it first; those whose column has one
 * entry left among the other rows (a source's current) are solved from that row last.
 *
 * The answers are certified and refined on the full network equations exactly as the
 * Hessenberg route's (certified-solve.ts); where the route declines, the LU answers.
 */
export interface ModalRoute {
	kind: 'modal';
	n: number;
	s0: number;
	/** The free unknowns (their rows are the same indices). */
	free: Int32Array;
	/** X and Xᵀ, row-major nf×nf; Λ. */
	x: Float64Array;
	xt: Float64Array;
	lambda: Float64Array;
	/** Entries of the free rows in pinned columns: local row, column, G and C parts. */
	coupling: Entries;
	/** Unknowns solved last, in order, each from its row. */
	last: { row: number; col: number; entries: Entries; g: number; c: number }[];
	pinned: PinnedRows;
	res: ResidualWork;
	bd: Float64Array;
	bAbs: Float64Array;
	zero: Float64Array;
	/** Work: free right-hand side, modal coordinates, free solution, a full correction. */
	yf: ComplexVector;
	zeta: ComplexVector;
	xf: ComplexVector;
	u: ComplexVector;
	c: ComplexVector;
	cAbs: Float64Array;
}

interface Entries {
	row: Int32Array;
	col: Int32Array;
	g: Float64Array;
	c: Float64Array;
}

/** Relative size under which a Cholesky pivot or a modal factor 1 + σλ counts as zero (the
 *  pivot-ratio test of lu.ts and of the Hessenberg route). */
const PIVOT_FLOOR = 1e-13;

/** The route at s0, or null when the structure or the definiteness does not hold. */
export function modalRoute(eq: Equations, s0: number): ModalRoute | null {
	const { n, g, cap } = eq;
	const pinned = pinnedRows(n, g, cap);
	const split = splitUnknowns(n, g, cap, pinned);
	if (!split) return null;
	const { free, last } = split;
	const nf = free.length;
	if (nf === 0) return null;
	const local = new Int32Array(n).fill(-1);
	free.forEach((u, i) => (local[u] = i));
	const a0 = new Float64Array(nf * nf);
	const cf = new Float64Array(nf * nf);
	const couplingList: [number, number, number, number][] = [];
	const rowEntries = new Map<number, Map<number, { g: number; c: number }>>();
	for (const { row } of last) rowEntries.set(row, new Map());
	const visit = (t: typeof g, isC: boolean) => {
		for (let k = 0; k < t.v.length; k++) {
			const r = t.r[k];
			const col = t.c[k];
			const v = t.v[k];
			const lr = local[r];
			if (lr >= 0) {
				const lc = local[col];
				if (lc >= 0) {
					a0[lr * nf + lc] += isC ? s0 * v : v;
					if (isC) cf[lr * nf + lc] += v;
				} else couplingList.push([lr, col, isC ? 0 : v, isC ? v : 0]);
			}
			const entries = rowEntries.get(r);
			if (entries) {
				const e = entries.get(col) ?? { g: 0, c: 0 };
				if (isC) e.c += v;
				else e.g += v;
				entries.set(col, e);
			}
		}
	};
	visit(g, false);
	visit(cap, true);
	if (!isSymmetric(a0, nf) || !isSymmetric(cf, nf)) return null;
	const l = cholesky(a0, nf, PIVOT_FLOOR);
	if (!l) return null;
	// M = L⁻¹·C·L⁻ᵀ: W = L⁻¹·C (C symmetric, so Wᵀ = C·L⁻ᵀ), then M = L⁻¹·Wᵀ.
	const w = lowerSolveRows(l, cf, nf);
	const m = lowerSolveRows(l, transpose(w, nf), nf);
	for (let i = 0; i < nf; i++)
		for (let j = i + 1; j < nf; j++) {
			const v = 0.5 * (m[i * nf + j] + m[j * nf + i]);
			m[i * nf + j] = v;
			m[j * nf + i] = v;
		}
	const eig = symmetricEigen(m, nf);
	if (!eig) return null;
	// X = L⁻ᵀ·U, U's columns the eigenvectors (rows of eig.vectors).
	const x = lowerTransposedSolveRows(l, transpose(eig.vectors, nf), nf);
	for (let i = 0; i < x.length; i++) if (!Number.isFinite(x[i])) return null;
	const bd = new Float64Array(n);
	for (let k = 0; k < eq.b.idx.length; k++) bd[eq.b.idx[k]] += eq.b.val[k];
	return {
		kind: 'modal',
		n,
		s0,
		free,
		x,
		xt: transpose(x, nf),
		lambda: eig.values,
		coupling: entriesFrom(couplingList),
		last: last.map(({ row, col }) => {
			const all = [...rowEntries.get(row)!].filter(([c]) => c !== col);
			const own = rowEntries.get(row)!.get(col)!;
			return {
				row,
				col,
				entries: entriesFrom(all.map(([c, e]) => [row, c, e.g, e.c])),
				g: own.g,
				c: own.c
			};
		}),
		pinned,
		res: residualWork(n),
		bd,
		bAbs: bd.map(Math.abs),
		zero: new Float64Array(n),
		yf: complexVector(nf),
		zeta: complexVector(nf),
		xf: complexVector(nf),
		u: complexVector(n),
		c: complexVector(n),
		cAbs: new Float64Array(n)
	};
}

/**
 * x = (G + sC)⁻¹·b and, when asked, y = (G + sC)⁻¹·C·x (so dx/ds = −y), both certified; false
 * when either is not, or when s is within rounding of a natural frequency (the caller falls
 * back to LU, which decides what to answer there).
 */
export function solveByModal(
	eq: Equations,
	route: ModalRoute,
	sr: number,
	si: number,
	x: ComplexVector,
	y: ComplexVector | null
): boolean {
	const dr = sr - route.s0;
	for (const lam of route.lambda) {
		const pr = 1 + dr * lam;
		const pi = si * lam;
		if (!(Math.abs(pr) + Math.abs(pi) > PIVOT_FLOOR * (1 + Math.abs(dr * lam) + Math.abs(pi))))
			return false;
	}
	const correct = (r: ComplexVector, into: ComplexVector) =>
		approxSolve(route, sr, si, r, into, true);
	approxSolve(route, sr, si, { re: route.bd, im: route.zero }, x, false);
	if (!certify(eq, route, sr, si, x, { re: route.bd, im: route.zero }, route.bAbs, correct))
		return false;
	if (!plain(x)) return false;
	if (!y) return true;
	applySparse(eq.cap, x.re, x.im, route.c.re, route.c.im, route.cAbs);
	approxSolve(route, sr, si, route.c, y, false);
	return (
		certify(eq, route, sr, si, y, route.c, route.cAbs, correct, DERIVATIVE_TOL, DERIVATIVE_TOL) &&
		plain(y)
	);
}

/** out = (G + sC)⁻¹·r by the route (out += … when `add`). */
function approxSolve(
	route: ModalRoute,
	sr: number,
	si: number,
	r: ComplexVector,
	out: ComplexVector,
	add: boolean
): void {
	const { free, pinned, coupling, yf, zeta, xf, u, lambda } = route;
	const nf = free.length;
	u.re.fill(0);
	u.im.fill(0);
	// Pinned unknowns from their one-entry rows.
	for (let k = 0; k < pinned.row.length; k++) {
		const [qr, qi] = divide(
			r.re[pinned.row[k]],
			r.im[pinned.row[k]],
			pinned.g[k],
			pinned.c[k],
			sr,
			si
		);
		u.re[pinned.col[k]] = qr;
		u.im[pinned.col[k]] = qi;
	}
	for (let i = 0; i < nf; i++) {
		yf.re[i] = r.re[free[i]];
		yf.im[i] = r.im[free[i]];
	}
	for (let k = 0; k < coupling.row.length; k++) {
		const ar = coupling.g[k] + sr * coupling.c[k];
		const ai = si * coupling.c[k];
		const vr = u.re[coupling.col[k]];
		const vi = u.im[coupling.col[k]];
		yf.re[coupling.row[k]] -= ar * vr - ai * vi;
		yf.im[coupling.row[k]] -= ar * vi + ai * vr;
	}
	realTimesComplex(route.xt, yf, zeta, nf, false);
	const dr = sr - route.s0;
	for (let k = 0; k < nf; k++) {
		const pr = 1 + dr * lambda[k];
		const pi = si * lambda[k];
		const d = pr * pr + pi * pi;
		const zr = zeta.re[k];
		const zi = zeta.im[k];
		zeta.re[k] = (zr * pr + zi * pi) / d;
		zeta.im[k] = (zi * pr - zr * pi) / d;
	}
	realTimesComplex(route.x, zeta, xf, nf, false);
	for (let i = 0; i < nf; i++) {
		u.re[free[i]] = xf.re[i];
		u.im[free[i]] = xf.im[i];
	}
	// Unknowns solved last, each from its own row.
	for (const t of route.last) {
		let br = r.re[t.row];
		let bi = r.im[t.row];
		const e = t.entries;
		for (let k = 0; k < e.col.length; k++) {
			const ar = e.g[k] + sr * e.c[k];
			const ai = si * e.c[k];
			const vr = u.re[e.col[k]];
			const vi = u.im[e.col[k]];
			br -= ar * vr - ai * vi;
			bi -= ar * vi + ai * vr;
		}
		const [qr, qi] = divide(br, bi, t.g, t.c, sr, si);
		u.re[t.col] = qr;
		u.im[t.col] = qi;
	}
	if (add)
		for (let i = 0; i < u.re.length; i++) {
			out.re[i] += u.re[i];
			out.im[i] += u.im[i];
		}
	else {
		out.re.set(u.re);
		out.im.set(u.im);
	}
}

/** (br + j·bi) / (g + s·c). */
function divide(br: number, bi: number, g: number, c: number, sr: number, si: number) {
	const ar = g + sr * c;
	const ai = si * c;
	const d = ar * ar + ai * ai;
	return [(br * ar + bi * ai) / d, (bi * ar - br * ai) / d];
}

/**
 * Pinned unknowns aside, peel unknowns whose column has one entry among the remaining rows
 * (solved last from that row); what remains must be a square block on the same indices.
 */
function splitUnknowns(
	n: number,
	g: Equations['g'],
	cap: Equations['cap'],
	pinned: PinnedRows
): { free: Int32Array; last: { row: number; col: number }[] } | null {
	const rowsOf: Set<number>[] = Array.from({ length: n }, () => new Set());
	for (const t of [g, cap])
		for (let k = 0; k < t.v.length; k++) if (t.v[k] !== 0) rowsOf[t.c[k]].add(t.r[k]);
	const rowGone = new Uint8Array(n);
	const colGone = new Uint8Array(n);
	for (let k = 0; k < pinned.row.length; k++) {
		rowGone[pinned.row[k]] = 1;
		colGone[pinned.col[k]] = 1;
	}
	const peeled: { row: number; col: number }[] = [];
	for (let changed = true; changed;) {
		changed = false;
		for (let c = 0; c < n; c++) {
			if (colGone[c]) continue;
			let only = -1;
			let count = 0;
			for (const r of rowsOf[c])
				if (!rowGone[r]) {
					count++;
					only = r;
				}
			if (count === 0) return null;
			if (count === 1) {
				peeled.push({ row: only, col: c });
				rowGone[only] = 1;
				colGone[c] = 1;
				changed = true;
			}
		}
	}
	const free: number[] = [];
	for (let i = 0; i < n; i++) {
		if (rowGone[i] !== colGone[i]) return null;
		if (!rowGone[i]) free.push(i);
	}
	// A peeled unknown's row holds only unknowns peeled after it (or free, or pinned): solve
	// them in the reverse order.
	return { free: Int32Array.from(free), last: peeled.reverse() };
}

function entriesFrom(list: [number, number, number, number][]): Entries {
	return {
		row: Int32Array.from(list, (e) => e[0]),
		col: Int32Array.from(list, (e) => e[1]),
		g: Float64Array.from(list, (e) => e[2]),
		c: Float64Array.from(list, (e) => e[3])
	};
}
