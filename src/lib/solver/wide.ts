/**
 * "Wide" complex numbers (mantissa · 2^ex) for the direct solves' results: the response of a
 * 300-section ladder a decade above its last pole is far below 1e-308 and would otherwise
 * underflow to exactly 0 (direct-solve.ts).
 */
export interface Wide {
	re: number;
	im: number;
	ex: number;
}

/** ln|w|, −Infinity for 0. */
export function logAbs(w: Wide): number {
	const m = Math.hypot(w.re, w.im);
	return m === 0 ? -Infinity : Math.log(m) + w.ex * Math.LN2;
}

/** The same number with its mantissa scaled to [1, 2) (exponent adjusted). */
function normalized(w: Wide): Wide {
	const m = Math.max(Math.abs(w.re), Math.abs(w.im));
	if (m === 0 || !Number.isFinite(m)) return w;
	const e = Math.floor(Math.log2(m));
	const s = 2 ** -e;
	return { re: w.re * s, im: w.im * s, ex: w.ex + e };
}

/** a/b as an ordinary complex number (the exponents mostly cancel). */
export function ratio(a0: Wide, b0: Wide): { re: number; im: number } {
	const a = normalized(a0);
	const b = normalized(b0);
	const d = b.re * b.re + b.im * b.im;
	const s = 2 ** (a.ex - b.ex);
	return {
		re: ((a.re * b.re + a.im * b.im) / d) * s,
		im: ((a.im * b.re - a.re * b.im) / d) * s
	};
}

/** The value as an ordinary complex number (±Infinity / 0 outside the double range). */
export function toComplex(w: Wide): { re: number; im: number } {
	const s = 2 ** w.ex;
	return { re: w.re * s, im: w.im * s };
}
