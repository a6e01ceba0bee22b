import { participation } from './participation';
import type { Root } from './poles';
import { singularity } from './singularity';
import type { PoleInfo, ResolvedNetwork } from './types';

/**
 * One exact pole as the designer reads it: Hz, Q, τ; the sequential estimate that stands for it
 * (the k-th smallest pole against the k-th element chosen, whose estimate is −1/τ) with its
 * relative error; and the elements that own it by participation.
 */
export function poleInfo(
	net: ResolvedNetwork,
	roots: Root[],
	order: number[],
	sequential: { element: string; tau: number | null }[],
	elementsOfPorts: number[]
): PoleInfo[] {
	return order.map((i, rank) => {
		const r = roots[i];
		const est = sequential[rank];
		const estRe = est && est.tau !== null && est.tau !== 0 ? -1 / est.tau : null;
		const mag = Math.hypot(r.re, r.im);
		return {
			...singularity(r.re, r.im),
			estimate: est
				? {
						element: est.element,
						tau: est.tau,
						re: estRe,
						hz: estRe === null ? null : Math.abs(estRe) / (2 * Math.PI)
					}
				: null,
			relativeError: estRe !== null && mag > 0 ? Math.hypot(estRe - r.re, r.im) / mag : null,
			owners: participation(net, elementsOfPorts, r),
			cancelledBy: null
		};
	});
}
