// Just enough complex arithmetic for 2×2 port matrices (plain { re, im } objects, as the solver
// returns them, so results stay JSON without conversion).
export interface C {
	re: number;
	im: number;
}
export type M2 = [[C, C], [C, C]];

export const one: C = { re: 1, im: 0 };
export const add = (a: C, b: C): C => ({ re: a.re + b.re, im: a.im + b.im });
export const sub = (a: C, b: C): C => ({ re: a.re - b.re, im: a.im - b.im });
export const mul = (a: C, b: C): C => ({
	re: a.re * b.re - a.im * b.im,
	im: a.re * b.im + a.im * b.re
});
export const scale = (a: C, k: number): C => ({ re: a.re * k, im: a.im * k });
export const abs = (a: C) => Math.hypot(a.re, a.im);
export function div(a: C, b: C): C {
	const d = b.re * b.re + b.im * b.im;
	return { re: (a.re * b.re + a.im * b.im) / d, im: (a.im * b.re - a.re * b.im) / d };
}

export function mul2(a: M2, b: M2): M2 {
	const e = (i: 0 | 1, j: 0 | 1) => add(mul(a[i][0], b[0][j]), mul(a[i][1], b[1][j]));
	return [
		[e(0, 0), e(0, 1)],
		[e(1, 0), e(1, 1)]
	];
}

/** Inverse, or null when |det| is at most `tiny` times the size of the products forming it. */
export function inv2(m: M2, tiny: number): M2 | null {
	const ad = mul(m[0][0], m[1][1]);
	const bc = mul(m[0][1], m[1][0]);
	const det = sub(ad, bc);
	if (!(abs(det) > tiny * Math.max(1, abs(ad) + abs(bc)))) return null;
	const k = (c: C) => div(c, det);
	return [
		[k(m[1][1]), k(scale(m[0][1], -1))],
		[k(scale(m[1][0], -1)), k(m[0][0])]
	];
}
