import { ldlNumeric, ldlSolve, type Ldl } from '../kernels/ldl';
import { inverseEntry, selectedInverse, type SelectedInverse } from '../kernels/selected-inverse';
import { GROUND, type PortReading, type ResolvedNetwork } from '../types';
import { symbolicOf, type NodalRC } from './rc-nodal';

/**
 * Zero-value (open-circuit) time constants of every capacitor port of a reciprocal RC network
 * at scale. With every capacitor open, the resistance port k sees is
 *
 *     R_k = Z_aa + Z_bb − 2·Z_ab,   Z = G⁻¹,
 *
 * for its node pair (a, b) (terms of a ground or source node are zero). Those entries of G⁻¹
 * all lie on the pattern of the factor — the capacitor pairs are part of the pattern the
 * factorization was planned on (rc-nodal.ts) — so one selected inversion
 * (selected-inverse.ts) gives every R_k at about the cost of the factorization, instead of one
 * solve per capacitor.
 *
 * A resistive component without a path to ground or a source is anchored at one node (no current
 * can flow through the anchor, so no reading inside the component changes); a port whose two
 * terminals lie in different components sees an infinite resistance (τ null), as in dc-ports.ts.
 */
export interface RcOpenCircuit {
	readings: PortReading[];
	/** Per port: unknown indices of its terminals (−1 for a reference). */
	pairs: [number, number][];
	resistance: Float64Array;
	factor: Ldl;
	inverse: SelectedInverse;
}

export function rcOpenCircuit(
	rc: NodalRC,
	tcNet: ResolvedNetwork,
	factorAtZero: Ldl | null
): RcOpenCircuit {
	const factor = factorAtZero ?? anchoredFactor(rc);
	const inverse = selectedInverse(factor);
	const idx = (node: number) => (node === GROUND ? -1 : rc.unknownOf[node]);
	const comp = (i: number) => (i < 0 ? rc.n : rc.component[i]);
	const pairs: [number, number][] = [];
	const resistance = new Float64Array(tcNet.reactive.length);
	const readings = tcNet.reactive.map((k, port) => {
		const e = tcNet.elements[k];
		const [a, b] = [idx(e.nodes[0]), idx(e.nodes[1])];
		pairs.push([a, b]);
		if (comp(a) !== comp(b)) {
			resistance[port] = Infinity;
			return { element: e.id, resistance: null, tau: null };
		}
		let r = 0;
		if (a >= 0) r += inverseEntry(factor, inverse, a, a);
		if (b >= 0) r += inverseEntry(factor, inverse, b, b);
		if (a >= 0 && b >= 0) r -= 2 * inverseEntry(factor, inverse, a, b);
		resistance[port] = r;
		return Number.isFinite(r)
			? { element: e.id, resistance: r, tau: e.value * r }
			: { element: e.id, resistance: null, tau: null };
	});
	return { readings, pairs, resistance, factor, inverse };
}

/** G with each floating resistive component anchored to the reference at one node. */
function anchoredFactor(rc: NodalRC): Ldl {
	const { n, pattern, g } = rc;
	const values = g.slice();
	const excess = rc.gExcess.slice();
	let scale = 0;
	const diagAt = new Int32Array(n).fill(-1);
	for (let j = 0; j < n; j++)
		for (let p = pattern.colPtr[j]; p < pattern.colPtr[j + 1]; p++)
			if (pattern.rowIdx[p] === j) {
				diagAt[j] = p;
				scale = Math.max(scale, g[p]);
			}
	const anchored = new Set<number>([n]);
	for (let i = 0; i < n; i++) {
		const c = rc.component[i];
		if (anchored.has(c)) continue;
		anchored.add(c);
		values[diagAt[i]] += scale || 1;
		excess[i] += scale || 1;
	}
	return ldlNumeric(symbolicOf(rc), values, excess);
}

/**
 * The largest-first sequential estimate for its first `steps` steps: take the port with the
 * largest τ, short it, repeat. Shorting port j changes G⁻¹ by one rank-one term,
 * Z ← Z − z·zᵀ / (p_jᵀ·z) with z = Z·p_j (the Sherman–Morrison formula), so each step is one
 * solve with the same factor plus O(n·step) work, and every other port's new resistance is its
 * old one minus (p_kᵀ·û)² for each stored û = z/√(p_jᵀ·z).
 */
export function rcSequential(
	rc: NodalRC,
	tcNet: ResolvedNetwork,
	oc: RcOpenCircuit,
	steps: number
): { element: string; tau: number | null }[] {
	const m = oc.pairs.length;
	if (oc.readings.some((r) => r.resistance === null)) return [];
	const n = rc.n;
	const R = Float64Array.from(oc.resistance);
	const value = tcNet.reactive.map((k) => tcNet.elements[k].value);
	const used = new Uint8Array(m);
	const updates: Float64Array[] = [];
	const out: { element: string; tau: number | null }[] = [];
	let rMax = 0;
	for (const r of oc.resistance) if (r > rMax) rMax = r;
	const along = (u: Float64Array, [a, b]: [number, number]) =>
		(a >= 0 ? u[a] : 0) - (b >= 0 ? u[b] : 0);
	for (let step = 0; step < Math.min(steps, m); step++) {
		let best = -1;
		for (let k = 0; k < m; k++)
			if (!used[k] && (best < 0 || value[k] * R[k] > value[best] * R[best])) best = k;
		used[best] = 1;
		out.push({ element: tcNet.elements[tcNet.reactive[best]].id, tau: value[best] * R[best] });
		const pivot = R[best];
		if (!(pivot > 1e-15 * rMax)) continue; // a port that reads nothing
		const z = new Float64Array(n);
		const [a, b] = oc.pairs[best];
		if (a >= 0) z[a] += 1;
		if (b >= 0) z[b] -= 1;
		ldlSolve(oc.factor, z);
		for (const u of updates) {
			const c = along(u, oc.pairs[best]);
			for (let i = 0; i < n; i++) z[i] -= c * u[i];
		}
		const s = 1 / Math.sqrt(pivot);
		for (let i = 0; i < n; i++) z[i] *= s;
		updates.push(z);
		for (let k = 0; k < m; k++) {
			if (used[k]) continue;
			const c = along(z, oc.pairs[k]);
			R[k] = Math.max(0, R[k] - c * c);
		}
	}
	return out;
}
