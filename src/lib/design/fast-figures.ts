import type { PzForm } from '../solver/frequency-response';

/**
 * Faster twin of the analysis' bandwidth, same definition. A tolerance run asks for it ten
 * thousand times, and the analysis' version (a 400-point scan with phase) is built to draw plots,
 * not to be called in a loop. Here the magnitude needs no atan2 and no square root, and the scan
 * is coarser; the crossing is still refined by bisection to double precision. The step figures
 * are the analysis' own (stepMetrics), whose grid is already sized to the poles.
 */
export function logMag2(pz: PzForm, w: number): number {
	let s = 2 * pz.logK;
	for (const z of pz.zeros) {
		const b = w - z.im;
		s += Math.log(z.re * z.re + b * b);
	}
	for (const p of pz.poles) {
		const b = w - p.im;
		s -= Math.log(p.re * p.re + b * b);
	}
	return s;
}

/** First −3 dB crossing scanning up from fMin (as the analysis defines it), in Hz. */
export function fastBandwidth(
	pz: PzForm,
	dcGain: number | null,
	range: { fMin: number; fMax: number },
	scan = 120
): number | null {
	if (dcGain === 0) return null;
	const at = (x: number) => logMag2(pz, 2 * Math.PI * Math.exp(x));
	const a = Math.log(range.fMin);
	const b = Math.log(range.fMax);
	const target = (dcGain !== null ? 2 * Math.log(Math.abs(dcGain)) : at(a)) - Math.log(2);
	let prev = a;
	for (let i = 1; i <= scan; i++) {
		const x = a + ((b - a) * i) / scan;
		if (at(x) < target) {
			let lo = prev;
			let hi = x;
			for (let k = 0; k < 80 && hi - lo > 1e-15; k++) {
				const mid = 0.5 * (lo + hi);
				if (at(mid) < target) hi = mid;
				else lo = mid;
			}
			return Math.exp(0.5 * (lo + hi));
		}
		prev = x;
	}
	return null;
}
