/**
 * Sample statistics of a tolerance run's figures. The standard deviation is the sample one
 * (n − 1), as the GUM's Type A evaluation uses (JCGM 100:2008, 4.2.2); percentiles interpolate
 * linearly between order statistics.
 */
export interface Statistics {
	/** Runs where the figure existed. */
	count: number;
	/** Runs asked for (count < runs when a figure was undefined in some runs). */
	runs: number;
	mean: number;
	std: number;
	min: number;
	max: number;
	p01: number;
	p50: number;
	p99: number;
}

export interface Histogram {
	lo: number;
	hi: number;
	counts: number[];
}

export function statistics(xs: number[], runs = xs.length): Statistics {
	const n = xs.length;
	if (n === 0)
		return {
			count: 0,
			runs,
			mean: NaN,
			std: NaN,
			min: NaN,
			max: NaN,
			p01: NaN,
			p50: NaN,
			p99: NaN
		};
	// Two-pass mean and variance: the figures are large numbers with small spreads (Hz, Ω).
	let mean = 0;
	for (const x of xs) mean += x;
	mean /= n;
	let ss = 0;
	for (const x of xs) ss += (x - mean) * (x - mean);
	const sorted = xs.slice().sort((a, b) => a - b);
	const pct = (p: number) => {
		const at = p * (n - 1);
		const i = Math.floor(at);
		return i + 1 < n ? sorted[i] + (sorted[i + 1] - sorted[i]) * (at - i) : sorted[n - 1];
	};
	return {
		count: n,
		runs,
		mean,
		std: n > 1 ? Math.sqrt(ss / (n - 1)) : 0,
		min: sorted[0],
		max: sorted[n - 1],
		p01: pct(0.01),
		p50: pct(0.5),
		p99: pct(0.99)
	};
}

export function histogram(xs: number[], bins: number): Histogram {
	if (xs.length === 0) return { lo: 0, hi: 0, counts: [] };
	let lo = Infinity;
	let hi = -Infinity;
	for (const x of xs) {
		lo = Math.min(lo, x);
		hi = Math.max(hi, x);
	}
	if (hi === lo) return { lo, hi, counts: [xs.length] };
	const counts = new Array<number>(bins).fill(0);
	for (const x of xs) counts[Math.min(bins - 1, Math.floor(((x - lo) / (hi - lo)) * bins))]++;
	return { lo, hi, counts };
}
