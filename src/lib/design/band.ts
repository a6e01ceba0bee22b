import type { Band, Metrics } from './evaluate';

/**
 * The band a flatness figure is judged over when the designer has not set one: from two decades
 * below the slowest singularity (where the response is its DC value) to a tenth of the −3 dB
 * frequency (so the roll-off itself is not counted as "not flat"). Without a bandwidth the
 * upper end is a decade above the fastest singularity.
 */
export function defaultBand(m: Pick<Metrics, 'poles' | 'zeros' | 'bandwidth'>): Band {
	const mags = [...m.poles, ...m.zeros].map((p) => Math.hypot(p.re, p.im) / (2 * Math.PI)).filter((x) => x > 0 && Number.isFinite(x));
	const fLo = mags.length ? Math.min(...mags) / 100 : 1;
	let fHi = m.bandwidth ? m.bandwidth / 10 : mags.length ? Math.max(...mags) * 10 : 1e6;
	if (!(fHi > fLo * 10)) fHi = fLo * 1e4;
	return { fLo, fHi };
}
