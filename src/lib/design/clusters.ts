/**
 * Is a tolerance run's figure one population or several? A rise time that is 415 ps in half the
 * runs and 27 µs in the other half (a pole pair that changes which one dominates) has a mean of
 * 201 ns that no run ever shows; mean ± σ would say something false. So before a figure is
 * summarized by its moments we look for gaps: split the sorted sample at its widest gap when
 * that gap is much wider than the spread on either side (interquartile range), and repeat on
 * each side. Positive figures are looked at in log10 (a figure that spans decades is judged by
 * ratios), others linearly.
 *
 * The rule (gap > GAP_IQR × the larger interquartile range of the two sides, each side at least
 * MIN_SHARE of the runs and 2 runs) is our own. For one population it virtually never fires:
 * the widest spacing of a normal sample of 10,000 is a fraction of σ, its IQR 1.35σ (checked on
 * normal, uniform and log-normal samples in clusters.test.ts).
 */
export interface Cluster {
	count: number;
	fraction: number;
	min: number;
	max: number;
	/** The cluster's median, the figure a reader should take as "near". */
	p50: number;
}

const GAP_IQR = 4;
const MIN_SHARE = 0.005;
const MAX_CLUSTERS = 4;
/** Gaps below this (relative, or decades in log) are round-off, not structure. */
const FLOOR = 1e-6;

function quantile(sorted: number[], lo: number, hi: number, p: number): number {
	const n = hi - lo;
	const at = p * (n - 1);
	const i = Math.floor(at);
	return i + 1 < n
		? sorted[lo + i] + (sorted[lo + i + 1] - sorted[lo + i]) * (at - i)
		: sorted[hi - 1];
}

/** The clusters of a sample, or null when it is one population (or too small to tell). */
export function findClusters(xs: number[]): Cluster[] | null {
	const n = xs.length;
	if (n < 20) return null;
	const sorted = xs.slice().sort((a, b) => a - b);
	const useLog = sorted[0] > 0;
	const t = useLog ? sorted.map(Math.log10) : sorted;
	const scale = useLog ? 1 : Math.max(Math.abs(t[0]), Math.abs(t[n - 1]));
	const minSize = Math.max(2, Math.ceil(MIN_SHARE * n));
	const iqr = (lo: number, hi: number) => quantile(t, lo, hi, 0.75) - quantile(t, lo, hi, 0.25);

	// Segments [lo, hi) of the sorted sample; split the one with the most convincing gap first.
	let segments: [number, number][] = [[0, n]];
	while (segments.length < MAX_CLUSTERS) {
		let best: { seg: number; at: number; score: number } | null = null;
		segments.forEach(([lo, hi], seg) => {
			for (let i = lo + minSize; i <= hi - minSize; i++) {
				const gap = t[i] - t[i - 1];
				if (gap <= FLOOR * (scale || 1)) continue;
				const spread = Math.max(iqr(lo, i), iqr(i, hi));
				const score = gap / Math.max(spread, FLOOR * (scale || 1));
				if (score > GAP_IQR && (!best || score > best.score)) best = { seg, at: i, score };
			}
		});
		if (!best) break;
		const { seg, at } = best as { seg: number; at: number };
		const [lo, hi] = segments[seg];
		segments = [...segments.slice(0, seg), [lo, at], [at, hi], ...segments.slice(seg + 1)];
	}
	if (segments.length === 1) return null;
	return segments.map(([lo, hi]) => ({
		count: hi - lo,
		fraction: (hi - lo) / n,
		min: sorted[lo],
		max: sorted[hi - 1],
		p50: quantile(sorted, lo, hi, 0.5)
	}));
}
