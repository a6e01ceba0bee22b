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
	const m = elements.length;
	const p = new Float64Array(m);
	let total = 0;
	for (let k = 0; k < m; k++) {
		const re = v.xr[k] * v.yr[k] - v.xi[k] * v.yi[k];
		const im = v.xr[k] * v.yi[k] + v.xi[k] * v.yr[k];
		p[k] = im === 0 ? Math.abs(re) : Math.hypot(re, im);
		total += p[k];
	}
	if (!(total > 0) || !Number.isFinite(total)) return [];
	const out: { element: string; share: number }[] = [];
	for (let k = 0; k < m; k++) {
		const share = p[k] / total;
		if (share >= 1e-6) out.push({ element: net.elements[elements[k]].id, share });
	}
	return out.sort((a, b) => b.share - a.share);
}
