import { assemble, type Assembled } from './assemble';
import { portModelFrom, SINGULAR_PIVOT, type PortModel } from './port-model';
import { SolverError } from './errors';
import type { ResolvedNetwork, TimeConstant } from './types';

/**
 * Picks the real shift s0 for the shift-and-invert reduction and builds the port model there.
 * For a passive RC network 1/Σ τ_oc lies below the smallest pole magnitude (Σ τ_oc = Σ 1/|p|),
 * which keeps every μ = −1/(p − s0) distinct and the slow poles exact; fast poles come out
 * with small μ and are polished. Positive real s0 cannot be a pole of a stable network; for an
 * unstable one (or an unlucky zero) the next shift in a fixed list is tried.
 */
export function shiftedModel(
	net: ResolvedNetwork,
	oc: TimeConstant[],
	sc: TimeConstant[]
): { a: Assembled; pm: PortModel; s0: number; scale: number } {
	const a = assemble(net, () => 'pencil');
	const scale = naturalScale(oc, sc);
	for (const f of [1, 2.718281828, 0.3678794412, 7.389056099, 0.1353352832, 20.08553692]) {
		const pm = portModelFrom(a, scale * f);
		if (pm.pivotRatio >= SINGULAR_PIVOT) return { a, pm, s0: scale * f, scale };
	}
	throw new SolverError('singular', "the network's equations have no unique solution at any frequency");
}

function naturalScale(oc: TimeConstant[], sc: TimeConstant[]): number {
	let sum = 0;
	for (const t of oc) if (t.tau !== null && Number.isFinite(t.tau)) sum += Math.abs(t.tau);
	if (sum > 0) return 1 / sum;
	let best = 0;
	for (const t of sc) if (t.tau !== null && t.tau !== 0) best = Math.max(best, 1 / Math.abs(t.tau));
	return best > 0 ? best : 1;
}
