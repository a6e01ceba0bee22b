import type { Singularity } from './types';

const fin = (x: number) => (Number.isFinite(x) ? x : null);

/**
 * The per-root figures a designer reads: Hz, time constant (null where infinite) and, for a
 * complex pair only, ω0, Q and ζ. A real root has no Q: the formula |s|/(−2·re) would give 0.5,
 * which describes a critically damped pair, not one real pole.
 */
export function singularity(re: number, im: number): Singularity {
	const mag = Math.hypot(re, im);
	const pair = im !== 0;
	return {
		re,
		im,
		hz: mag / (2 * Math.PI),
		q: pair && re !== 0 ? mag / (-2 * re) : null,
		zeta: pair ? -re / mag : null,
		omega0: pair ? mag : null,
		tau: re !== 0 ? fin(-1 / re) : null
	};
}

export const byMagnitude = (a: { re: number; im: number }, b: { re: number; im: number }) =>
	Math.hypot(a.re, a.im) - Math.hypot(b.re, b.im) || a.im - b.im;
