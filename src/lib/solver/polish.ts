import { cluFactor, cluSolve } from './complex-lu';
import type { Assembled, Sparse } from './assemble';

/**
 * A pencil G + sC in dense form, for refining singularities found through the shifted port
 * matrix. For zeros it is the bordered (Rosenbrock) pencil [[G + sC, b], [cᵀ, 0]].
 */
export interface Pencil {
	n: number;
	g: Float64Array;
	/** Entries of C as [row, col, value]. */
	c: [number, number, number][];
}

export function polePencil(a: Assembled): Pencil {
	const c: Pencil['c'] = [];
	for (const p of a.ports)
		for (const [r, x] of p.vec) for (const [q, y] of p.vec) c.push([r, q, p.d * x * y]);
	return { n: a.size, g: a.g.slice(), c };
}

export function zeroPencil(a: Assembled): Pencil {
	const n = a.size + 1;
	const g = new Float64Array(n * n);
	for (let i = 0; i < a.size; i++)
		for (let j = 0; j < a.size; j++) g[i * n + j] = a.g[i * a.size + j];
	const put = (v: Sparse, col: boolean) => {
		for (const [r, x] of v) {
			if (col) g[r * n + a.size] += x;
			else g[a.size * n + r] += x;
		}
	};
	put(a.b, true);
	put(a.c, false);
	return { n, g, c: polePencil(a).c };
}

/**
 * Shift-and-invert Rayleigh iteration on the pencil at the current estimate s: with
 * T = (G + sC)⁻¹C, an eigenvector x gives T x = −x/(p − s), so p = s − 1/ν for the Rayleigh
 * quotient ν of T. Converges in two or three steps from a six-digit estimate. Bounded at
 * `maxIter`; a step that is non-finite or jumps away (to another singularity) is refused.
 */
export function polish(
	pen: Pencil,
	re: number,
	im: number,
	maxIter = 6
): { re: number; im: number } {
	const n = pen.n;
	const r0 = Math.hypot(re, im);
	if (r0 === 0) return { re, im };
	let sr = re;
	let si = im;
	let xr = new Float64Array(n);
	let xi = new Float64Array(n);
	for (let i = 0; i < n; i++) xr[i] = 1 + ((i * 7919) % 13) / 13;
	for (let it = 0; it <= maxIter; it++) {
		const ar = pen.g.slice();
		const ai = new Float64Array(n * n);
		for (const [r, c, v] of pen.c) {
			ar[r * n + c] += sr * v;
			ai[r * n + c] += si * v;
		}
		const lu = cluFactor(ar, ai, n);
		if (lu.singular) break;
		const wr = new Float64Array(n);
		const wi = new Float64Array(n);
		for (const [r, c, v] of pen.c) {
			wr[r] += v * xr[c];
			wi[r] += v * xi[c];
		}
		cluSolve(lu, wr, wi);
		if (it > 0) {
			// ν = xᴴw / xᴴx
			let nr = 0,
				ni = 0,
				dd = 0;
			for (let i = 0; i < n; i++) {
				nr += xr[i] * wr[i] + xi[i] * wi[i];
				ni += xr[i] * wi[i] - xi[i] * wr[i];
				dd += xr[i] * xr[i] + xi[i] * xi[i];
			}
			nr /= dd;
			ni /= dd;
			const n2 = nr * nr + ni * ni;
			if (!(n2 > 0) || !Number.isFinite(n2)) break;
			const tr = sr - nr / n2;
			const ti = si + ni / n2;
			if (!Number.isFinite(tr) || !Number.isFinite(ti)) break;
			if (Math.hypot(tr - re, ti - im) > 1e-3 * r0) break;
			const step = Math.hypot(tr - sr, ti - si);
			sr = tr;
			si = im === 0 ? 0 : ti;
			if (step <= 1e-14 * Math.hypot(sr, si)) break;
		}
		let mx = 0;
		for (let i = 0; i < n; i++) mx = Math.max(mx, Math.hypot(wr[i], wi[i]));
		if (!(mx > 0) || !Number.isFinite(mx)) break;
		for (let i = 0; i < n; i++) {
			wr[i] /= mx;
			wi[i] /= mx;
		}
		xr = wr;
		xi = wi;
	}
	return { re: sr, im: si };
}
