import { assemble, type Assembled } from './assemble';
import { portModelFrom, SINGULAR_PIVOT, type PortModel } from './port-model';
import { SolverError } from './errors';
import type { ResolvedNetwork, PortReading } from './types';

/**
 * Picks the real shift s0 for the shift-and-invert reduction and builds the port model there.
 *
 * A root p comes out of s = s0 − 1/μ with a relative error of about ε·max(|p|/s0, s0/|p|), so
 * the best shift is the geometric middle of the spectrum: with a spread S the error is ε·√S at
 * both ends (2e-11 for ten decades) instead of ε·S for a shift at one end. The ends are bounded
 * before any eigenvalue is known: for a passive network 1/Σ τ_oc ≤ |p_min| (Σ τ_oc = Σ 1/|p|)
 * and |p_max| ≤ Σ 1/τ_sc (= Σ |p|). Positive real s0 cannot be a pole of a stable network;
 * for an unstable one (or an unlucky zero) the next shift in a fixed list is tried.
 */
export function shiftedModel(
	net: ResolvedNetwork,
	oc: PortReading[],
	sc: PortReading[]
): { a: Assembled; pm: PortModel; s0: number; scale: number } {
	const a = assemble(net, () => 'pencil');
	const scale = naturalScale(oc, sc);
	for (const f of [1, 2.718281828, 0.3678794412, 7.389056099, 0.1353352832, 20.08553692]) {
		const pm = portModelFrom(a, scale * f);
		if (pm.pivotRatio >= SINGULAR_PIVOT) return { a, pm, s0: scale * f, scale };
	}
	throw new SolverError(
		'singular',
		"the network's equations have no unique solution at any frequency"
	);
}

function naturalScale(oc: PortReading[], sc: PortReading[]): number {
	let sum = 0;
	for (const t of oc) if (t.tau !== null && Number.isFinite(t.tau)) sum += Math.abs(t.tau);
	let rate = 0;
	for (const t of sc)
		if (t.tau !== null && t.tau !== 0 && Number.isFinite(1 / t.tau)) rate += 1 / Math.abs(t.tau);
	const lo = sum > 0 ? 1 / sum : 0;
	if (lo > 0 && rate > lo) return Math.sqrt(lo * rate);
	if (lo > 0) return lo;
	return rate > 0 ? rate : 1;
}
