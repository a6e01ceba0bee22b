// The s-plane on a log-polar scale, shared by the single-network map and the variants' overlay:
// the angle of each point is its true angle, the distance from the centre is log10 |s| (one ring
// per decade), so poles decades apart are all visible and their left/right, real/complex nature
// still reads at a glance.

export interface LogPolar {
	/** The centre (the plot is size × size). */
	c: number;
	/** The decades drawn as rings (log10 of |s|). */
	rings: number[];
	radius: (magnitude: number) => number;
	place: (re: number, im: number) => { x: number; y: number };
}

export function logPolar(magnitudes: number[], size: number, inner = 22, margin = 18): LogPolar {
	const c = size / 2;
	const r1 = c - margin;
	const m = magnitudes.filter((x) => x > 0 && Number.isFinite(x));
	const dMin = m.length ? Math.floor(Math.log10(Math.min(...m))) : 0;
	const dMax = m.length ? Math.max(dMin + 1, Math.ceil(Math.log10(Math.max(...m)))) : 1;
	const radius = (mag: number) =>
		mag <= 0 ? 0 : inner + ((Math.log10(mag) - dMin) / (dMax - dMin)) * (r1 - inner);
	return {
		c,
		rings: Array.from({ length: dMax - dMin + 1 }, (_, i) => dMin + i),
		radius,
		place: (re, im) => {
			const r = radius(Math.hypot(re, im));
			const a = Math.atan2(im, re);
			return { x: c + r * Math.cos(a), y: c - r * Math.sin(a) };
		}
	};
}
