import type { Singularity } from './types';

const fin = (x: number) => (Number.isFinite(x) ? x : null);

/** The per-root figures a designer reads: Hz, Q, damping, time constant (null where infinite). */
export function singularity(re: number, im: number): Singularity {
	const mag = Math.hypot(re, im);
	return {
		re,
		im,
		hz: mag / (2 * Math.PI),
		q: mag > 0 && re !== 0 ? mag / (-2 * re) : null,
		zeta: mag > 0 ? -re / mag : null,
		tau: re !== 0 ? fin(-1 / re) : null
	};
}

export const byMagnitude = (a: { re: number; im: number }, b: { re: number; im: number }) =>
	Math.hypot(a.re, a.im) - Math.hypot(b.re, b.im) || a.im - b.im;
