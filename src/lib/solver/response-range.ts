import { logMagPz, type PzForm } from './frequency-response';
import type { Root } from './poles';

/** Two decades beyond the extreme finite, non-zero singularities; 1 Hz–1 MHz when there are none. */
export function frequencyRange(
	poles: { re: number; im: number }[],
	zeros: { re: number; im: number }[],
	opt?: { fMin?: number; fMax?: number }
): { fMin: number; fMax: number } {
	const mags = [...poles, ...zeros]
		.map((p) => Math.hypot(p.re, p.im) / (2 * Math.PI))
		.filter((m) => m > 0 && Number.isFinite(m));
	let fMin = mags.length ? Math.min(...mags) / 100 : 1;
	let fMax = mags.length ? Math.max(...mags) * 100 : 1e6;
	if (opt?.fMin !== undefined && opt.fMin > 0) fMin = opt.fMin;
	if (opt?.fMax !== undefined && opt.fMax > fMin) fMax = opt.fMax;
	if (!(fMax > fMin)) fMax = fMin * 1e4;
	return { fMin, fMax };
}

/**
 * The −3 dB frequency: first point, scanning up from fMin, where |H| falls below 1/√2 of
 * |DC gain|, refined by bisection in log f. Null when there is no finite non-zero DC gain to
 * refer to — a high-pass (DC gain 0), or a pole at the origin (an integrator has no bandwidth) —
 * or when no crossing lies in range.
 */
export function bandwidth(
	pz: PzForm,
	dcGain: number | null,
	range: { fMin: number; fMax: number }
): number | null {
	if (dcGain === 0 || dcGain === null) return null;
	const logAt = (f: number) => logMagPz(pz, 2 * Math.PI * f);
	const ref = Math.log(Math.abs(dcGain));
	const target = ref - 0.5 * Math.log(2);
	const n = 400;
	const a = Math.log(range.fMin);
	const b = Math.log(range.fMax);
	let prev = a;
	for (let i = 1; i <= n; i++) {
		const x = a + ((b - a) * i) / n;
		if (logAt(Math.exp(x)) < target) {
			let lo = prev;
			let hi = x;
			for (let k = 0; k < 80 && hi - lo > 1e-15; k++) {
				const mid = 0.5 * (lo + hi);
				if (logAt(Math.exp(mid)) < target) hi = mid;
				else lo = mid;
			}
			return Math.exp(0.5 * (lo + hi));
		}
		prev = x;
	}
	return null;
}

/** Coefficient of the lowest power of s in the numerator N(s) = H(s)·Π(1 − s/p). */
export function numeratorScale(
	pz: PzForm | null,
	poles: Root[],
	zeros: Root[],
	dcGain: number | null
): number | null {
	const atOrigin = zeros.filter((z) => z.re === 0 && z.im === 0).length;
	if (atOrigin === 0) return dcGain;
	if (!pz) return null;
	let log = pz.logK;
	let sign = Math.cos(pz.argK) < 0 ? -1 : 1;
	for (const p of poles) {
		log -= Math.log(Math.hypot(p.re, p.im));
		if (p.im === 0) sign *= -Math.sign(p.re);
	}
	for (const z of zeros) {
		if (z.re === 0 && z.im === 0) continue;
		log += Math.log(Math.hypot(z.re, z.im));
		if (z.im === 0) sign *= -Math.sign(z.re);
	}
	return sign * Math.exp(log);
}
