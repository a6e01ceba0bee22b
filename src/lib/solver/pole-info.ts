import { participation } from './participation';
import { poleEstimates } from './pole-estimates';
import type { Root } from './poles';
import { singularity } from './singularity';
import type { PoleInfo, ResolvedNetwork } from './types';

/**
 * One exact pole as the designer reads it: Hz, τ, and for a complex pair ω0, Q and ζ; its quick
 * estimates (coefficient ratios, the two-pole roots, the sequential port of the same rank), best
 * first, each with its error; and the elements that own it by participation — per element, even
 * where the time-constant view groups parallel capacitors into one port.
 */
export function poleInfo(
	net: ResolvedNetwork,
	roots: Root[],
	order: number[],
	sequential: { element: string; tau: number | null }[],
	elementsOfPorts: number[],
	b: number[]
): PoleInfo[] {
	const sorted = order.map((i) => roots[i]);
	const estimates = poleEstimates(sorted, b, sequential);
	return sorted.map((r, rank) => {
		const list = estimates[rank];
		return {
			...singularity(r.re, r.im),
			estimate: list[0] ?? null,
			estimates: list,
			relativeError: list[0]?.relativeError ?? null,
			owners: participation(net, elementsOfPorts, r),
			cancelledBy: null
		};
	});
}
