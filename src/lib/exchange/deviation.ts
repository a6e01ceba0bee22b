// Model against measurement over a band: at each measured frequency inside the band (and inside
// the model's own frequency list) the model's magnitude is interpolated linearly in log-frequency
// — the way a Bode plot is read — and the difference measured − model is taken in dB.

export interface Curve {
	f: number[];
	magnitudeDb: (number | null)[];
}

export interface Deviation {
	/** Measured points compared. */
	points: number;
	/** Largest |measured − model| in dB, with its frequency and sign. */
	maxDb: number | null;
	maxAtHz: number | null;
	signedAtMax: number | null;
	rmsDb: number | null;
	/** The band actually compared (the requested band clipped to both curves). */
	fMin: number | null;
	fMax: number | null;
	/** Measured points in the band the model does not reach. */
	skipped: number;
}

/** Model magnitude at `f` (Hz) by linear interpolation in log10 f; null outside its range. */
export function modelDbAt(model: Curve, f: number): number | null {
	const xs = model.f;
	const n = xs.length;
	if (n === 0 || f < xs[0] || f > xs[n - 1]) return null;
	let lo = 0;
	let hi = n - 1;
	while (hi - lo > 1) {
		const mid = (lo + hi) >> 1;
		if (xs[mid] <= f) lo = mid;
		else hi = mid;
	}
	const a = model.magnitudeDb[lo];
	const b = model.magnitudeDb[hi];
	if (a === null || b === null) return null;
	if (xs[hi] === xs[lo]) return a;
	const t = (Math.log10(f) - Math.log10(xs[lo])) / (Math.log10(xs[hi]) - Math.log10(xs[lo]));
	return a + t * (b - a);
}

export function deviation(
	model: Curve,
	measured: Curve,
	band: { fMin?: number | null; fMax?: number | null } = {}
): Deviation {
	const lo = band.fMin ?? -Infinity;
	const hi = band.fMax ?? Infinity;
	let points = 0;
	let skipped = 0;
	let sumSq = 0;
	let max: { d: number; f: number } | null = null;
	let first: number | null = null;
	let last: number | null = null;
	measured.f.forEach((f, i) => {
		if (f < lo || f > hi) return;
		const m = measured.magnitudeDb[i];
		const at = modelDbAt(model, f);
		if (m === null || at === null) {
			skipped++;
			return;
		}
		const d = m - at;
		points++;
		sumSq += d * d;
		if (!max || Math.abs(d) > Math.abs(max.d)) max = { d, f };
		first ??= f;
		last = f;
	});
	const peak = max as { d: number; f: number } | null;
	return {
		points,
		maxDb: peak ? Math.abs(peak.d) : null,
		maxAtHz: peak ? peak.f : null,
		signedAtMax: peak ? peak.d : null,
		rmsDb: points ? Math.sqrt(sumSq / points) : null,
		fMin: first,
		fMax: last,
		skipped
	};
}
