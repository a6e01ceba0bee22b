import type { Root } from './poles';
import type { ResolvedNetwork } from './types';

/**
 * Participation of each reactive element in a pole: |x_k · y_k| normalized to sum 1, with x and
 * y the right and left eigenvectors of the port matrix D·H. The product is unchanged by any
 * diagonal change of coordinates (balancing, charge vs voltage), so it measures how much of
 * the mode lives in element k rather than an artefact of units (Pérez-Arriaga, Verghese and
 * Schweppe, IEEE Trans. PAS 101(9), 1982).
 */
export function participation(
	net: ResolvedNetwork,
	elements: number[],
	root: Root
): { element: string; share: number }[] {
	const v = root.vectors;
	if (!v) return [];
	const p = elements.map((_, k) =>
		Math.hypot(v.xr[k] * v.yr[k] - v.xi[k] * v.yi[k], v.xr[k] * v.yi[k] + v.xi[k] * v.yr[k])
	);
	const total = p.reduce((s, x) => s + x, 0);
	if (!(total > 0) || !Number.isFinite(total)) return [];
	return elements
		.map((k, i) => ({ element: net.elements[k].id, share: p[i] / total }))
		.filter((o) => o.share >= 1e-6)
		.sort((a, b) => b.share - a.share);
}
