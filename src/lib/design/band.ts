import type { Band, Metrics } from './evaluate';

/**
 * The band a flatness figure is judged over when the designer has not set one. It starts two
 * decades below the slowest pole or zero (where the response sits at its DC value). Where the
 * singularities fall into a slow group and a fast group more than two decades apart (a divider's
 * pole–zero pair, then the pole its source resistance makes), the band ends three decades above
 * the slow group but a decade short of the fast one, so the fast roll-off is not counted as
 * "not flat"; otherwise it ends two decades above the fastest.
 */
export function defaultBand(m: Pick<Metrics, 'poles' | 'zeros'>): Band {
	const f = [...m.poles, ...m.zeros]
		.map((p) => Math.hypot(p.re, p.im) / (2 * Math.PI))
		.filter((x) => x > 0 && Number.isFinite(x))
		.sort((a, b) => a - b);
	if (f.length === 0) return { fLo: 1, fHi: 1e6 };
	let gap = 1;
	let at = -1;
	for (let i = 1; i < f.length; i++) {
		if (f[i] / f[i - 1] > gap) {
			gap = f[i] / f[i - 1];
			at = i;
		}
	}
	const fLo = f[0] / 100;
	const fHi = gap > 100 ? Math.min(f[at - 1] * 1000, f[at] / 10) : f[f.length - 1] * 100;
	return { fLo, fHi };
}
