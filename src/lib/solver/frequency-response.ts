import { assemble, dense, dot } from './assemble';
import { cluFactor, cluSolve } from './complex-lu';
import { validateNetwork } from './validate';
import type { ResolvedNetwork } from './types';

/**
 * Frequency response from the pole–zero form, in logarithms so a thousand factors neither
 * overflow nor lose digits:  H(jω) = K Π(jω − z) / Π(jω − p),  K fixed by H(s0) at the shift.
 * Group delay is exact from the same form: τg = −Re(H′/H) = Re Σ 1/(jω − p) − Re Σ 1/(jω − z).
 */
export interface PzForm {
	logK: number;
	argK: number;
	poles: { re: number; im: number }[];
	zeros: { re: number; im: number }[];
}

export function pzForm(
	poles: { re: number; im: number }[],
	zeros: { re: number; im: number }[],
	s0: number,
	h0: number
): PzForm {
	let logK = Math.log(Math.abs(h0));
	let argK = h0 < 0 ? Math.PI : 0;
	for (const p of poles) {
		logK += Math.log(Math.hypot(s0 - p.re, -p.im));
		argK += Math.atan2(-p.im, s0 - p.re);
	}
	for (const z of zeros) {
		logK -= Math.log(Math.hypot(s0 - z.re, -z.im));
		argK -= Math.atan2(-z.im, s0 - z.re);
	}
	// K is real: snap its phase to 0 or π.
	argK = Math.cos(argK) < 0 ? Math.PI : 0;
	return { logK, argK, poles, zeros };
}

/**
 * Σ ± log|jω − r| over the roots, as the logarithm of running products of |jω − r|²: one log per
 * ~sixty factors instead of one per factor, with no loss of digits (a product of k factors
 * carries about k rounding errors, 1e-14 in the log for a thousand). Factors are multiplied in
 * only while both the product and the factor stay inside 1e±140, so the product never leaves
 * 1e±280; anything outside goes through ½·log(a² + b²), or log(hypot) where the square itself
 * would overflow or underflow.
 */
const BIG = 1e140;
const SMALL = 1e-140;

function logAbsSquaredSum(roots: { re: number; im: number }[], w: number): number {
	let sum = 0;
	let prod = 1;
	for (const r of roots) {
		const a = -r.re;
		const b = w - r.im;
		const q = a * a + b * b;
		if (q < BIG && q > SMALL) {
			prod *= q;
			if (prod > BIG || prod < SMALL) {
				sum += Math.log(prod);
				prod = 1;
			}
		} else sum += q > 1e-300 && q < 1e300 ? Math.log(q) : 2 * Math.log(Math.hypot(a, b));
	}
	return sum + Math.log(prod);
}

export function evalPz(pz: PzForm, w: number): { logMag: number; arg: number; groupDelay: number } {
	let arg = pz.argK;
	let gd = 0;
	for (const z of pz.zeros) {
		const a = -z.re;
		const b = w - z.im;
		arg += Math.atan2(b, a);
		gd -= a / (a * a + b * b);
	}
	for (const p of pz.poles) {
		const a = -p.re;
		const b = w - p.im;
		arg -= Math.atan2(b, a);
		gd += a / (a * a + b * b);
	}
	return { logMag: logMagPz(pz, w), arg, groupDelay: gd };
}

/** log|H(jω)| alone (no phase, no delay), for searches such as the bandwidth. */
export function logMagPz(pz: PzForm, w: number): number {
	return pz.logK + 0.5 * (logAbsSquaredSum(pz.zeros, w) - logAbsSquaredSum(pz.poles, w));
}

/** Log-spaced frequencies in Hz. */
export function logSpace(fMin: number, fMax: number, points: number): number[] {
	const n = Math.max(2, Math.floor(points));
	const a = Math.log10(fMin);
	const b = Math.log10(fMax);
	return Array.from({ length: n }, (_, i) => 10 ** (a + ((b - a) * i) / (n - 1)));
}

/**
 * Direct complex solve of the full network equations (G + jωC) x = b at each frequency: no
 * eigen-decomposition involved, so design aids and exports can trust it on any network.
 * O(N³) per frequency. Infinite impedances (an open input) read null.
 */
export function frequencyResponseAt(
	network: ResolvedNetwork | unknown,
	freqsHz: number[]
): { f: number[]; h: { re: number; im: number }[]; zin: ({ re: number; im: number } | null)[] } {
	const net = isResolved(network) ? network : validateNetwork(network);
	const a = assemble(net, () => 'pencil');
	const n = a.size;
	const isV = net.elements[net.input].type === 'V';
	const h: { re: number; im: number }[] = [];
	const zin: ({ re: number; im: number } | null)[] = [];
	for (const f of freqsHz) {
		const w = 2 * Math.PI * f;
		const re = a.g.slice();
		const im = new Float64Array(n * n);
		for (const p of a.ports)
			for (const [r, x] of p.vec) for (const [c, y] of p.vec) im[r * n + c] += w * p.d * x * y;
		const lu = cluFactor(re, im, n);
		const br = dense(a.b, n);
		const bi = new Float64Array(n);
		cluSolve(lu, br, bi);
		h.push({ re: dot(a.c, br), im: dot(a.c, bi) });
		const zr = dot(a.zin, br);
		const zi = dot(a.zin, bi);
		if (isV) {
			const d = zr * zr + zi * zi;
			zin.push(d > 0 && Number.isFinite(d) ? { re: zr / d, im: -zi / d } : null);
		} else zin.push(Number.isFinite(zr) && Number.isFinite(zi) ? { re: zr, im: zi } : null);
	}
	return { f: freqsHz.slice(), h, zin };
}

function isResolved(x: unknown): x is ResolvedNetwork {
	return typeof x === 'object' && x !== null && 'reactive' in x && 'nodeNames' in x;
}
