import type { Assembled, Sparse } from './assemble';
import { bandOrder } from './band-order';
import {
	bandFactor,
	bandSolve,
	bandSolvePlain,
	bandWorkspace,
	wideVector,
	type BandLU,
	type WideVector
} from './kernels/complex-band-lu';
import { buildReduction, solveByReduction, type Reduction } from './reduced-route';
import { logAbs, ratio, toComplex, type Wide } from './wide';

export { logAbs, ratio, toComplex, type Wide };

/**
 * The network equations themselves at a complex frequency: (G + sC)·x = b, solved directly —
 * the ground truth for the frequency response, group delay and input impedance (no
 * eigenvectors, no pole–zero form). The unknowns are renumbered once by reverse Cuthill–McKee
 * (band-order.ts), so a ladder factors as a band of width one or two and a point costs O(N).
 * Everything that depends on the factorization kernel is behind solveAt(), so a sparse kernel
 * can replace the band one without touching the callers. Where the band stays wide (a mesh with
 * long-range couplings: O(n³) per point), one Hessenberg reduction at the analysis' shift serves
 * every point in O(n²), each answer certified on these equations (hessenberg-route.ts); a point
 * it cannot certify is solved by the banded LU.
 *
 * Results are "wide" complex numbers (wide.ts).
 */

/** A sparse vector as parallel typed arrays (read in every solve). */
interface Functional {
	idx: Int32Array;
	val: Float64Array;
}

export interface DirectSystem {
	n: number;
	/** New position of each original unknown. */
	pos: Int32Array;
	g: { r: Int32Array; c: Int32Array; v: Float64Array };
	cap: { r: Int32Array; c: Int32Array; v: Float64Array };
	b: Functional;
	out: Functional;
	zin: Functional;
	lu: BandLU;
	rs: Float64Array;
	x: WideVector;
	y: WideVector;
	/** Which solver answers first: chosen by cost (chooseRoute); tests may set it. */
	route: 'band' | 'hessenberg';
	/** The real shift the Hessenberg route reduces at (null: no route). */
	s0: number | null;
	/** The reduction, built at the first solve (null: G + s0·C was singular): the modal one
	 *  where the equations allow it (modal-route.ts), else the Hessenberg one. */
	reduced: Reduction | null | undefined;
	/** (G + s0·C)⁻¹ in the original numbering, column-major, when the caller already has it. */
	inverseAtShift: Float64Array | null;
	/** Points answered by the Hessenberg route / handed to the banded LU after it declined. */
	stats: { hessenberg: number; fallback: number };
	/** Answers by s (see solveAt). */
	kept: Map<string, { p: DirectPoint | null }>;
	/** Scratch for the refinement's residual (refineOnce). */
	rr?: Float64Array;
	ri?: Float64Array;
}

/** Forces one route for every system built while it is set, and counts what the Hessenberg
 *  route answered and handed on over all systems (tests compare the two routes). */
export const routeOverride: {
	route: DirectSystem['route'] | null;
	/** Which reduction the 'hessenberg' route builds (null: the modal one where it applies). */
	reduction: 'modal' | 'hessenberg' | null;
	answered: number;
	declined: number;
} = { route: null, reduction: null, answered: 0, declined: 0 };

/** Solves expected per analysis: a 200-point sweep with its derivative, the bandwidth search,
 *  the agreement and zero checks. Only the order of magnitude matters. */
const EXPECTED_SOLVES = 300;

/**
 * The banded LU costs at most 4·n·kl·(2kl + ku) real multiply–adds a point (less where the band
 * holds zeros, which it skips); the Hessenberg route about 6n³ once (factor, K, reduction, P)
 * and some 25n² a point (factor, substitutions, the products with Q and P, the residual checks
 * with one refinement each). Measured on the bench's meshes (docs/performance.md), the route
 * loses below about 40 unknowns (fixed costs per point) and wins from 52 on; so it is taken from
 * 40 unknowns when the count says it is four times cheaper.
 */
export function chooseRoute(
	n: number,
	kl: number,
	ku: number,
	s0: number | null
): DirectSystem['route'] {
	if (s0 === null || !(s0 > 0) || !Number.isFinite(s0) || n < 40) return 'band';
	const band = EXPECTED_SOLVES * 4 * n * kl * (2 * kl + ku);
	const reduced = 6 * n ** 3 + EXPECTED_SOLVES * 25 * n * n;
	return 4 * reduced < band ? 'hessenberg' : 'band';
}

export interface DirectPoint {
	/** c·x: the transfer. */
	h: Wide;
	/** dH/ds = −c·(G + sC)⁻¹·C·x (one more solve with the same factors), when asked. */
	dh: Wide | null;
	/** The input functional (current the V input delivers / voltage across the I input). */
	zin: Wide;
}

function triplets(list: [number, number, number][]) {
	// Plain loops: TypedArray.from with a map function goes through the iterator protocol.
	const r = new Int32Array(list.length);
	const c = new Int32Array(list.length);
	const v = new Float64Array(list.length);
	for (let k = 0; k < list.length; k++) {
		r[k] = list[k][0];
		c[k] = list[k][1];
		v[k] = list[k][2];
	}
	return { r, c, v };
}

/** `s0`: a real shift where G + s0·C is regular (the analysis' own), enabling the Hessenberg
 *  route; without it every point is a banded LU. */
export function directSystem(
	a: Assembled,
	s0: number | null = null,
	inverseAtShift: Float64Array | null = null
): DirectSystem {
	const n = a.size;
	// The pattern of G + sC for the ordering: G's entries plus every port's outer product.
	const pattern = a.g.slice();
	const capList: [number, number, number][] = [];
	for (const p of a.ports)
		for (const [r, x] of p.vec)
			for (const [c, y] of p.vec) {
				capList.push([r, c, p.d * x * y]);
				pattern[r * n + c] += 1;
			}
	const order = bandOrder(pattern, n);
	const pos = new Int32Array(n);
	for (let i = 0; i < n; i++) pos[order ? order[i] : i] = i;
	const gList: [number, number, number][] = [];
	for (let i = 0; i < n; i++)
		for (let j = 0; j < n; j++) {
			const v = a.g[i * n + j];
			if (v !== 0) gList.push([pos[i], pos[j], v]);
		}
	const cMapped = capList.map(([r, c, v]) => [pos[r], pos[c], v] as [number, number, number]);
	let kl = 0;
	let ku = 0;
	for (const list of [gList, cMapped])
		for (let k = 0; k < list.length; k++) {
			const d = list[k][0] - list[k][1];
			if (d > kl) kl = d;
			else if (-d > ku) ku = -d;
		}
	const remap = (v: Sparse): Functional => ({
		idx: Int32Array.from(v, ([r]) => pos[r]),
		val: Float64Array.from(v, ([, x]) => x)
	});
	return {
		n,
		pos,
		g: triplets(gList),
		cap: triplets(cMapped),
		b: remap(a.b),
		out: remap(a.c),
		zin: remap(a.zin),
		lu: bandWorkspace(n, kl, ku),
		rs: new Float64Array(n),
		x: wideVector(n),
		y: wideVector(n),
		route:
			routeOverride.route && s0 !== null
				? routeOverride.route
				: a.ports.length
					? chooseRoute(n, kl, ku, s0)
					: 'band',
		s0,
		reduced: undefined,
		inverseAtShift,
		stats: { hessenberg: 0, fallback: 0 },
		kept: new Map()
	};
}

/** The point by the Hessenberg route, or null when it declines (see hessenberg-route.ts). */
function solveReduced(
	sys: DirectSystem,
	sr: number,
	si: number,
	derivative: boolean
): DirectPoint | null {
	const eq = { n: sys.n, g: sys.g, cap: sys.cap, b: sys.b };
	if (sys.reduced === undefined)
		sys.reduced = buildReduction(eq, sys.s0!, sys.inverseAtShift, sys.pos, routeOverride.reduction);
	const route = sys.reduced;
	if (!route) return null;
	const { x, y } = sys;
	x.ex.fill(0);
	y.ex.fill(0);
	const answered = solveByReduction(eq, route, sr, si, x, derivative ? y : null);
	if (!answered) return null;
	let dh: Wide | null = null;
	if (derivative) {
		const t = wideDot(sys.out, y);
		dh = { re: -t.re, im: -t.im, ex: t.ex };
	}
	return { h: wideDot(sys.out, x), dh, zin: wideDot(sys.zin, x) };
}

/** Factors G + sC; false when it is singular at this s (a pole exactly there). */
function factorAt(sys: DirectSystem, sr: number, si: number): boolean {
	const { lu, g, cap, rs } = sys;
	const { w, kl, re, im } = lu;
	re.fill(0);
	im.fill(0);
	for (let k = 0; k < g.v.length; k++) re[g.r[k] * w + (g.c[k] - g.r[k] + kl)] += g.v[k];
	for (let k = 0; k < cap.v.length; k++) {
		const at = cap.r[k] * w + (cap.c[k] - cap.r[k] + kl);
		re[at] += sr * cap.v[k];
		im[at] += si * cap.v[k];
	}
	// Row equilibration: node rows are in siemens, branch rows dimensionless; pivoting compares
	// like with like only after each row's largest entry is 1.
	for (let i = 0; i < sys.n; i++) {
		let mx = 0;
		for (let j = i * w; j < (i + 1) * w; j++) {
			const v = (re[j] < 0 ? -re[j] : re[j]) + (im[j] < 0 ? -im[j] : im[j]);
			if (v > mx) mx = v;
		}
		const s = mx > 0 ? 1 / mx : 1;
		rs[i] = s;
		if (s !== 1)
			for (let j = i * w; j < (i + 1) * w; j++) {
				re[j] *= s;
				im[j] *= s;
			}
	}
	bandFactor(lu);
	return !lu.singular;
}

function load(sys: DirectSystem, v: WideVector, f: Functional) {
	v.re.fill(0);
	v.im.fill(0);
	v.ex.fill(0);
	for (let k = 0; k < f.idx.length; k++) v.re[f.idx[k]] += f.val[k] * sys.rs[f.idx[k]];
}

/**
 * Solves in place: plain doubles first, the wide solve only when the solution leaves 1e±280
 * (`rhs` refills v for the second attempt).
 */
function solveInto(sys: DirectSystem, v: WideVector, rhs: () => void): void {
	rhs();
	if (bandSolvePlain(sys.lu, v.re, v.im)) return;
	rhs();
	bandSolve(sys.lu, v);
}

/** Σ coef·v[r] over a sparse functional, as one wide number. */
function wideDot(f: Functional, v: WideVector): Wide {
	let ex = -Infinity;
	for (let k = 0; k < f.idx.length; k++) {
		const r = f.idx[k];
		if (v.re[r] !== 0 || v.im[r] !== 0) ex = Math.max(ex, v.ex[r]);
	}
	if (ex === -Infinity) return { re: 0, im: 0, ex: 0 };
	let re = 0;
	let im = 0;
	for (let k = 0; k < f.idx.length; k++) {
		const r = f.idx[k];
		const d = v.ex[r] - ex;
		const s = d === 0 ? 1 : d < -1000 ? 0 : 2 ** d;
		re += f.val[k] * v.re[r] * s;
		im += f.val[k] * v.im[r] * s;
	}
	return { re, im, ex };
}

/** The network at s = sr + j·si; null where G + sC is singular (s is a pole). */
export function solveAt(
	sys: DirectSystem,
	sr: number,
	si: number,
	derivative = false
): DirectPoint | null {
	// The zero checks ask for the same points twice when the analysis takes its second look for
	// zeros beside poles (analyze.ts): answers are kept per s (a derivative answer serves both),
	// from a size where a solve costs far more than the look-up.
	if (sys.n < KEEP_FROM) return solveFresh(sys, sr, si, derivative);
	const key = `${sr} ${si}`;
	const kept = sys.kept.get(key);
	if (kept && (kept.p === null || !derivative || kept.p.dh)) return kept.p;
	const p = solveFresh(sys, sr, si, derivative);
	if (sys.kept.size < KEEP_AT_MOST) sys.kept.set(key, { p });
	return p;
}

/** Answers kept per system; enough for every solve of an analysis of the dense back end. */
const KEEP_AT_MOST = 8192;
const KEEP_FROM = 40;

function solveFresh(
	sys: DirectSystem,
	sr: number,
	si: number,
	derivative: boolean
): DirectPoint | null {
	// s = 0 exactly stays with the LU: a floating part makes G singular there, which only an
	// exact zero pivot shows (the certificate cannot: a tiny change of G makes it regular).
	if (sys.route === 'hessenberg' && (sr !== 0 || si !== 0)) {
		const p = solveReduced(sys, sr, si, derivative);
		if (p) {
			sys.stats.hessenberg++;
			routeOverride.answered++;
			return p;
		}
		sys.stats.fallback++;
		// No reduction at all (the forced one does not apply): nothing was declined.
		if (sys.reduced) routeOverride.declined++;
	}
	if (!factorAt(sys, sr, si)) return null;
	const { x, y, cap, rs } = sys;
	solveInto(sys, x, () => load(sys, x, sys.b));
	refineOnce(sys, x, sys.b, sr, si);
	const h = wideDot(sys.out, x);
	const zin = wideDot(sys.zin, x);
	let dh: Wide | null = null;
	if (derivative) {
		// y = C·x, accumulated with the exponent of its largest term, then A⁻¹·y.
		let top = -Infinity;
		for (let k = 0; k < cap.v.length; k++) {
			const c = cap.c[k];
			if (x.re[c] !== 0 || x.im[c] !== 0) top = Math.max(top, x.ex[c]);
		}
		const fill = () => {
			y.re.fill(0);
			y.im.fill(0);
			y.ex.fill(top === -Infinity ? 0 : top);
			if (top === -Infinity) return;
			for (let k = 0; k < cap.v.length; k++) {
				const c = cap.c[k];
				const d = x.ex[c] - top;
				if (d < -1000) continue;
				const s = cap.v[k] * rs[cap.r[k]] * (d === 0 ? 1 : 2 ** d);
				y.re[cap.r[k]] += s * x.re[c];
				y.im[cap.r[k]] += s * x.im[c];
			}
		};
		if (top !== -Infinity) solveInto(sys, y, fill);
		else fill();
		const t = wideDot(sys.out, y);
		dh = { re: -t.re, im: -t.im, ex: t.ex };
	}
	return { h, dh, zin };
}

/**
 * One step of iterative refinement in working precision: r = D·(b − (G + sC)·x) from the
 * network's own entries (the band holds the factors by now), A·d = r with the same factors,
 * x += d. One such step makes Gaussian elimination with partial pivoting componentwise
 * backward stable (Skeel, "Iterative refinement implies numerical stability for Gaussian
 * elimination", Math. Comp. 35, 1980), which is what a tiny output of a network with a wide
 * value spread needs: a ten-decade RC network read −422.949 dB where the exact value is
 * −422.959 dB. Only for the plain-double solve (a wide solve has no such cancellation).
 */
function refineOnce(sys: DirectSystem, v: WideVector, b: Functional, sr: number, si: number): void {
	const { n, g, cap, rs } = sys;
	for (let i = 0; i < n; i++) if (v.ex[i] !== 0) return;
	const rr = (sys.rr ??= new Float64Array(n));
	const ri = (sys.ri ??= new Float64Array(n));
	rr.fill(0);
	ri.fill(0);
	for (let k = 0; k < b.idx.length; k++) rr[b.idx[k]] += b.val[k];
	for (let k = 0; k < g.v.length; k++) {
		const c = g.c[k];
		rr[g.r[k]] -= g.v[k] * v.re[c];
		ri[g.r[k]] -= g.v[k] * v.im[c];
	}
	for (let k = 0; k < cap.v.length; k++) {
		const c = cap.c[k];
		const [xr, xi] = [v.re[c], v.im[c]];
		rr[cap.r[k]] -= cap.v[k] * (sr * xr - si * xi);
		ri[cap.r[k]] -= cap.v[k] * (sr * xi + si * xr);
	}
	for (let i = 0; i < n; i++) {
		rr[i] *= rs[i];
		ri[i] *= rs[i];
	}
	if (!bandSolvePlain(sys.lu, rr, ri)) return;
	for (let i = 0; i < n; i++) {
		v.re[i] += rr[i];
		v.im[i] += ri[i];
	}
}
