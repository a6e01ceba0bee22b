// Axis ticks for our plots: decades (with 2 and 5 between when few) on log axes, d3's nice
// linear ticks elsewhere; labels in engineering notation.
import { scaleLinear, scaleLog } from 'd3-scale';
import { formatEngineering } from '$lib/solver/notation';

export function logScale(domain: [number, number], range: [number, number]) {
	return scaleLog().domain(domain).range(range).clamp(true);
}

export function linearScale(domain: [number, number], range: [number, number]) {
	const [a, b] = domain;
	const d: [number, number] = a === b ? [a - 1, b + 1] : [a, b];
	return scaleLinear().domain(d).range(range).nice();
}

export function decadeTicks(lo: number, hi: number): { value: number; major: boolean }[] {
	const out: { value: number; major: boolean }[] = [];
	const d0 = Math.floor(Math.log10(lo));
	const d1 = Math.ceil(Math.log10(hi));
	const minor = d1 - d0 <= 4;
	for (let d = d0; d <= d1; d++) {
		for (const m of minor ? [1, 2, 5] : [1]) {
			const v = m * 10 ** d;
			if (v >= lo * 0.999 && v <= hi * 1.001) out.push({ value: v, major: m === 1 });
		}
	}
	return out;
}

export const hz = (v: number) => formatEngineering(v, 'Hz', 3);
export const sec = (v: number) => formatEngineering(v, 's', 3);

/** Index of the sample nearest to x (xs ascending). */
export function nearest(xs: number[], x: number): number {
	let lo = 0;
	let hi = xs.length - 1;
	while (hi - lo > 1) {
		const mid = (lo + hi) >> 1;
		if (xs[mid] < x) lo = mid;
		else hi = mid;
	}
	return Math.abs(xs[lo] - x) <= Math.abs(xs[hi] - x) ? lo : hi;
}

/** SVG path through the finite points (gaps where a value is null). */
export function linePath(
	xs: number[],
	ys: (number | null)[],
	sx: (v: number) => number,
	sy: (v: number) => number
): string {
	let d = '';
	let pen = false;
	for (let i = 0; i < xs.length; i++) {
		const y = ys[i];
		if (y === null || !Number.isFinite(y)) {
			pen = false;
			continue;
		}
		d += `${pen ? 'L' : 'M'}${sx(xs[i]).toFixed(1)} ${sy(y).toFixed(1)}`;
		pen = true;
	}
	return d;
}
