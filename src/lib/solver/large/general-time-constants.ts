import { dot } from '../assemble';
import {
	luSolveSparse,
	luSolveSparseTransposed,
	sparseLu,
	type SparseLu
} from '../kernels/sparse-lu';
import type { PortReading, ResolvedNetwork } from '../types';
import { sparseMna, type SparseMna } from './sparse-mna';

/**
 * Zero-value time constants of a general large network (inductors, controlled sources): the
 * zero-value configuration (capacitors open as current ports, inductors shorted as voltage
 * ports; assemble.ts) factored once by the sparse LU, then one solve per port for its own
 * reading, τ = d·H_kk as in time-constants.ts. (Selected inversion needs a symmetric factor;
 * reciprocal RC networks take time-constants-rc.ts instead.)
 *
 * When that configuration has no unique solution (a part with no DC path, a loop of shorts),
 * the readings are unknown (null) and the caller says so: the structural handling of those
 * cases is the dense path's (dc-ports.ts).
 */
export interface GeneralOpenCircuit {
	readings: PortReading[];
	diag: Float64Array;
	mna: SparseMna;
	factor: SparseLu | null;
}

export function generalOpenCircuit(tcNet: ResolvedNetwork): GeneralOpenCircuit {
	const mna = sparseMna(tcNet, (k) => (tcNet.elements[k].type === 'C' ? 'iport' : 'vport'));
	const m = mna.ports.length;
	const diag = new Float64Array(m).fill(NaN);
	const factor = sparseLu({ ...mna.pattern, values: mna.g });
	const ok = !factor.singular && factor.pivotRatio > 1e-13;
	const x = new Float64Array(mna.size);
	const readings = mna.ports.map((p, i) => {
		const e = tcNet.elements[p.element];
		if (!ok) return { element: e.id, resistance: null, tau: null };
		x.fill(0);
		for (const [r, v] of p.vec) x[r] += v;
		luSolveSparse(factor, x);
		const h = dot(p.vec, x);
		diag[i] = h;
		if (e.type === 'C') return { element: e.id, resistance: h, tau: e.value * h };
		return { element: e.id, resistance: h !== 0 ? -1 / h : null, tau: -e.value * h + 0 };
	});
	return { readings, diag, mna, factor: ok ? factor : null };
}

/**
 * First `steps` steps of the largest-first sequence on the general factor: holding port j at its
 * infinite value is the rank-one update H ← H − H[:, j]·H[j, :] / H_jj; column j comes from one
 * solve, row j from one transposed solve, and earlier updates are applied to both, so k steps
 * cost 2k solves.
 */
export function generalSequential(
	tcNet: ResolvedNetwork,
	oc: GeneralOpenCircuit,
	steps: number
): { element: string; tau: number | null }[] {
	const { mna, factor } = oc;
	if (!factor) return [];
	const m = mna.ports.length;
	const d = mna.ports.map((p) => p.d);
	const H = Float64Array.from(oc.diag);
	const cols: Float64Array[] = [];
	const rows: Float64Array[] = [];
	const pivots: number[] = [];
	const used = new Uint8Array(m);
	const out: { element: string; tau: number | null }[] = [];
	const x = new Float64Array(mna.size);
	const readAll = (v: Float64Array) => Float64Array.from(mna.ports, (p) => dot(p.vec, v));
	for (let step = 0; step < Math.min(steps, m); step++) {
		let best = -1;
		for (let k = 0; k < m; k++)
			if (!used[k] && (best < 0 || d[k] * H[k] > d[best] * H[best])) best = k;
		used[best] = 1;
		const tau = d[best] * H[best];
		out.push({
			element: tcNet.elements[mna.ports[best].element].id,
			tau: Number.isFinite(tau) ? tau : null
		});
		x.fill(0);
		for (const [r, v] of mna.ports[best].vec) x[r] += v;
		const col = readAll(luSolveSparse(factor, x.slice()));
		const row = readAll(luSolveSparseTransposed(factor, x.slice()));
		for (let s = 0; s < cols.length; s++) {
			const cj = rows[s][best] / pivots[s];
			const rj = cols[s][best] / pivots[s];
			for (let k = 0; k < m; k++) {
				col[k] -= cols[s][k] * cj;
				row[k] -= rows[s][k] * rj;
			}
		}
		const pivot = col[best];
		if (!(Math.abs(pivot) > 1e-15 * Math.abs(oc.diag[best]))) continue;
		cols.push(col);
		rows.push(row);
		pivots.push(pivot);
		for (let k = 0; k < m; k++) if (!used[k]) H[k] -= (col[k] * row[k]) / pivot;
	}
	return out;
}
