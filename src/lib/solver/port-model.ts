import { assemble, dot, type Assembled, type ReactiveMode } from './assemble';
import { luFactor, luSolve, type RealLU } from './lu';
import type { ResolvedNetwork } from './types';

/**
 * The network seen from its reactive ports, with every reactive element at value·s0 folded in
 * (s0 = 0: the resistive network with C open and L shorted). With σ = s − s0 and D = diag(d):
 *
 *     H(s) = h0 − σ · g D (I + σ H D)⁻¹ h
 *
 * so the poles are s0 − 1/μ for the eigenvalues μ ≠ 0 of H·D, and one factorization of the
 * N×N matrix serves poles, zeros, participation, responses and the time constants. The
 * reduction works even where the full matrix pencil has infinite eigenvalues (capacitor loops,
 * inductor cut sets, nodes without capacitance): they become exact zeros of H·D here.
 */
export interface PortModel {
	m: number;
	s0: number;
	/** Port matrix, row-major m×m: entry (i, j) is port i's reading for a unit drive at port j. */
	H: Float64Array;
	/** Port readings for a unit input. */
	h: Float64Array;
	/** Output for a unit drive at each port. */
	g: Float64Array;
	/** Input-impedance functional for a unit drive at each port. */
	gz: Float64Array;
	h0: number;
	hz0: number;
	d: Float64Array;
	elements: number[];
	pivotRatio: number;
	/**
	 * The factorization of G + s0·C behind H, kept so the pole problem can be set up on the
	 * network's nodes instead of its ports (node-space-spectrum.ts); null when it is singular.
	 */
	lu: RealLU | null;
	/** A⁻¹ = (G + s0·C)⁻¹, column-major (inverse[c·n + r] = (A⁻¹)ᵣ꜀), when it was formed (more
	 *  ports than unknowns); the wide-band response route reuses it (hessenberg-route.ts). */
	inverse?: Float64Array;
}

/** Pivot ratio under which a factorization is taken as singular (see docs/methods.md). */
export const SINGULAR_PIVOT = 1e-13;

export function portModelFrom(a: Assembled, s0: number): PortModel {
	const n = a.size;
	const m = a.ports.length;
	const mat = a.g.slice();
	if (s0 !== 0) {
		for (const p of a.ports) {
			for (const [r, x] of p.vec) for (const [c, y] of p.vec) mat[r * n + c] += s0 * p.d * x * y;
		}
	}
	const lu = luFactor(mat, n, true);
	const model: PortModel = {
		m,
		s0,
		H: new Float64Array(m * m),
		h: new Float64Array(m),
		g: new Float64Array(m),
		gz: new Float64Array(m),
		h0: 0,
		hz0: 0,
		d: Float64Array.from(a.ports.map((p) => p.d)),
		elements: a.ports.map((p) => p.element),
		pivotRatio: lu.pivotRatio,
		lu: lu.pivotRatio < SINGULAR_PIVOT ? null : lu
	};
	if (lu.pivotRatio < SINGULAR_PIVOT) return model;
	const col = new Float64Array(n);
	if (m > n) fillFromInverse(a, lu, model);
	else
		for (let j = 0; j < m; j++) {
			col.fill(0);
			for (const [r, x] of a.ports[j].vec) col[r] += x;
			luSolve(lu, col);
			for (let i = 0; i < m; i++) model.H[i * m + j] = dot(a.ports[i].vec, col);
			model.g[j] = dot(a.c, col);
			model.gz[j] = dot(a.zin, col);
		}
	col.fill(0);
	for (const [r, x] of a.b) col[r] += x;
	luSolve(lu, col);
	for (let i = 0; i < m; i++) model.h[i] = dot(a.ports[i].vec, col);
	model.h0 = dot(a.c, col);
	model.hz0 = dot(a.zin, col);
	return model;
}

/**
 * H, g and gz when there are more ports than unknowns (a mesh with capacitors across its
 * branches as well as to ground): the n columns of A⁻¹ cost n solves instead of m, and each
 * entry pᵢᵀ·A⁻¹·pⱼ is then read from at most four of its entries (a port vector has one or two).
 * Same products as the solve per port, summed in the same order within each vector.
 */
function fillFromInverse(a: Assembled, lu: ReturnType<typeof luFactor>, model: PortModel): void {
	const n = a.size;
	const m = a.ports.length;
	const inv = new Float64Array(n * n); // column-major: inv[c·n + r] = (A⁻¹)[r][c]
	model.inverse = inv;
	const col = new Float64Array(n);
	for (let c = 0; c < n; c++) {
		col.fill(0);
		col[c] = 1;
		luSolve(lu, col);
		inv.set(col, c * n);
	}
	// Column j of A⁻¹·P, gathered into col, then read as the solve per port would.
	for (let j = 0; j < m; j++) {
		col.fill(0);
		for (const [c, y] of a.ports[j].vec) {
			const base = c * n;
			for (let r = 0; r < n; r++) col[r] += y * inv[base + r];
		}
		for (let i = 0; i < m; i++) model.H[i * m + j] = dot(a.ports[i].vec, col);
		model.g[j] = dot(a.c, col);
		model.gz[j] = dot(a.zin, col);
	}
}

export function portModel(
	net: ResolvedNetwork,
	s0: number,
	mode: (k: number) => ReactiveMode = () => 'pencil'
): PortModel {
	return portModelFrom(assemble(net, mode), s0);
}
