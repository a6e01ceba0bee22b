// How each variant is drawn in overlaid plots: a dash pattern, a marker shape and a colour. The
// dash and marker alone tell every variant apart (up to 42), so nothing depends on colour; the
// legend and every table name the variant in words.

export type MarkerShape = 'circle' | 'square' | 'triangle' | 'diamond' | 'cross' | 'plus' | 'star';

export interface VariantStyle {
	dash: string;
	marker: MarkerShape;
	/** A CSS colour from the theme's variables. */
	color: string;
}

const DASHES = ['', '7 4', '2 3', '10 3 2 3', '4 4', '12 4 2 4 2 4'];
const MARKERS: MarkerShape[] = ['circle', 'square', 'triangle', 'diamond', 'cross', 'plus', 'star'];
const COLORS = ['--pw-signal', '--pw-trace', '--pw-ink', '--pw-caution', '--pw-pass', '--pw-fault'];

export function variantStyle(i: number): VariantStyle {
	return {
		dash: DASHES[i % DASHES.length],
		marker: MARKERS[(i + Math.floor(i / DASHES.length)) % MARKERS.length],
		color: `rgb(var(${COLORS[i % COLORS.length]}))`
	};
}

/** An SVG path for a marker of radius r centred at (x, y). */
export function markerPath(shape: MarkerShape, x: number, y: number, r = 3.5): string {
	const f = (v: number) => v.toFixed(1);
	switch (shape) {
		case 'circle':
			return `M${f(x - r)} ${f(y)}a${r} ${r} 0 1 0 ${2 * r} 0a${r} ${r} 0 1 0 ${-2 * r} 0`;
		case 'square':
			return `M${f(x - r)} ${f(y - r)}h${2 * r}v${2 * r}h${-2 * r}z`;
		case 'triangle':
			return `M${f(x)} ${f(y - r)}L${f(x + r)} ${f(y + r)}L${f(x - r)} ${f(y + r)}z`;
		case 'diamond':
			return `M${f(x)} ${f(y - r)}L${f(x + r)} ${f(y)}L${f(x)} ${f(y + r)}L${f(x - r)} ${f(y)}z`;
		case 'cross':
			return `M${f(x - r)} ${f(y - r)}L${f(x + r)} ${f(y + r)}M${f(x + r)} ${f(y - r)}L${f(x - r)} ${f(y + r)}`;
		case 'plus':
			return `M${f(x - r)} ${f(y)}H${f(x + r)}M${f(x)} ${f(y - r)}V${f(y + r)}`;
		case 'star':
			return `M${f(x - r)} ${f(y)}H${f(x + r)}M${f(x)} ${f(y - r)}V${f(y + r)}M${f(x - r * 0.7)} ${f(y - r * 0.7)}L${f(x + r * 0.7)} ${f(y + r * 0.7)}M${f(x + r * 0.7)} ${f(y - r * 0.7)}L${f(x - r * 0.7)} ${f(y + r * 0.7)}`;
	}
}

/** Filled shapes are drawn filled; the line shapes (cross, plus, star) are strokes only. */
export const filledMarker = (s: MarkerShape) => !['cross', 'plus', 'star'].includes(s);

/** Sample indices for markers along a curve of n points: k marks, shifted per variant so marks of
 * overlapping curves do not sit on top of each other. */
export function markerIndices(n: number, variant: number, count: number, k = 7): number[] {
	if (n < 2) return n ? [0] : [];
	const out: number[] = [];
	for (let j = 0; j < k; j++)
		out.push(Math.round(((j + (variant + 0.5) / Math.max(1, count)) / k) * (n - 1)));
	return [...new Set(out)].filter((i) => i >= 0 && i < n);
}
