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
	// Sort the kept indices on the raw numbers, then build the objects once, in order. Small
	// lists (every pole of a 50-element sheet) go by insertion sort on a typed array: a sort
	// with a comparator callback cost more than all the rest of this function.
	const floor = 1e-6 * total;
	const keep = new Int32Array(m);
	let count = 0;
	for (let k = 0; k < m; k++) if (p[k] >= floor) keep[count++] = k;
	if (count <= 64) {
		for (let i = 1; i < count; i++) {
			const k = keep[i];
			const v = p[k];
			let j = i - 1;
			while (j >= 0 && p[keep[j]] < v) {
				keep[j + 1] = keep[j];
				j--;
			}
			keep[j + 1] = k;
		}
	} else keep.subarray(0, count).sort((a, b) => p[b] - p[a] || a - b);
	const out: { element: string; share: number }[] = new Array(count);
	for (let i = 0; i < count; i++) {
		const k = keep[i];
		out[i] = { element: net.elements[elements[k]].id, share: p[k] / total };
	}
	return out;
}
