/**
 * Residual and componentwise backward error of a complex solution of (A + s·B)·x = b, with A
 * and B real sparse matrices given as triplets (row, column, value; repeats add up). The
 * backward error is Oettli and Prager's (Numer. Math. 6, 1964):
 *
 *     ω = maxᵢ |b − (A + sB)x|ᵢ / (|A||x| + |s||B||x| + |b|)ᵢ,
 *
 * the smallest relative change of the entries of A, B and b (each separately, zeros kept) for
 * which x is the exact solution. A row whose residual is exactly zero counts as 0; one with a
 * non-zero residual and a zero denominator as Infinity.
 */
export interface Triplets {
	r: Int32Array;
	c: Int32Array;
	v: Float64Array;
}

export interface ResidualWork {
	rr: Float64Array;
	ri: Float64Array;
	den: Float64Array;
}

export function residualWork(n: number): ResidualWork {
	return { rr: new Float64Array(n), ri: new Float64Array(n), den: new Float64Array(n) };
}

/**
 * Writes r = b − (A + sB)·x into w.rr / w.ri and returns ω. `bAbs` is |b| as the perturbation
 * of b is measured (for b = B·x0 a caller passes |B|·|x0|).
 */
export function pencilResidual(
	a: Triplets,
	bm: Triplets,
	sr: number,
	si: number,
	xr: Float64Array,
	xi: Float64Array,
	br: Float64Array,
	bi: Float64Array,
	bAbs: Float64Array,
	w: ResidualWork
): number {
	const { rr, ri, den } = w;
	const n = rr.length;
	for (let i = 0; i < n; i++) {
		rr[i] = br[i];
		ri[i] = bi[i];
		den[i] = bAbs[i];
	}
	subtractProduct(a, 1, 0, xr, xi, w);
	subtractProduct(bm, sr, si, xr, xi, w);
	let omega = 0;
	for (let i = 0; i < n; i++) {
		const num = Math.sqrt(rr[i] * rr[i] + ri[i] * ri[i]);
		if (num === 0) continue;
		const e = num / den[i];
		if (!(e <= omega)) omega = e; // NaN and Infinity (a zero denominator) win
	}
	return omega;
}

/** r −= (zr + j·zi)·M·x and den += |z|·|M|·|x|. */
function subtractProduct(
	m: Triplets,
	zr: number,
	zi: number,
	xr: Float64Array,
	xi: Float64Array,
	w: ResidualWork
): void {
	const { rr, ri, den } = w;
	const zAbs = Math.sqrt(zr * zr + zi * zi);
	for (let k = 0; k < m.v.length; k++) {
		const r = m.r[k];
		const c = m.c[k];
		const v = m.v[k];
		const x = xr[c];
		const y = xi[c];
		const ar = zr * v;
		const ai = zi * v;
		rr[r] -= ar * x - ai * y;
		ri[r] -= ar * y + ai * x;
		den[r] += zAbs * Math.abs(v) * Math.sqrt(x * x + y * y);
	}
}

/** y = B·x and |B|·|x| (the right-hand side of a derivative solve, with its own size). */
export function applySparse(
	bm: Triplets,
	xr: Float64Array,
	xi: Float64Array,
	yr: Float64Array,
	yi: Float64Array,
	yAbs: Float64Array
): void {
	yr.fill(0);
	yi.fill(0);
	yAbs.fill(0);
	for (let k = 0; k < bm.v.length; k++) {
		const r = bm.r[k];
		const c = bm.c[k];
		const v = bm.v[k];
		const x = xr[c];
		const y = xi[c];
		yr[r] += v * x;
		yi[r] += v * y;
		yAbs[r] += Math.abs(v) * Math.sqrt(x * x + y * y);
	}
}
