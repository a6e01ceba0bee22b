import { dcPorts, type DcPorts } from './dc-ports';
import type { ResolvedNetwork } from './types';

/**
 * The dominant-pole sequence: take the largest zero-value time constant, hold that element at
 * its infinite value (capacitor shorted, inductor open), recompute the others, repeat.
 *
 * Holding port j at its infinite value forces its reading to zero with its drive free, which
 * is one Schur-complement (rank-one) update of the port matrix: H ← H − H[:,j] H[j,:] / Hjj.
 * That makes the whole sequence O(m³) instead of m fresh factorizations (O(m·N³)). Only when
 * a reading is structurally infinite (a floating node, a loop of shorts) is the configuration
 * rebuilt from the network, because an infinite pivot has no rank-one form.
 */
export function sequentialTimeConstants(
	net: ResolvedNetwork,
	oc: DcPorts
): { element: string; tau: number | null }[] {
	const held = new Set<number>();
	const out: { element: string; tau: number | null }[] = [];
	let ports = oc;
	let H = oc.H.slice();
	let alive = oc.elements.map((_, i) => i);
	let upper = symmetrize(H, ports.m);
	const m0 = net.reactive.length;
	for (let step = 0; step < m0 && alive.length > 0; step++) {
		const m = ports.m;
		let best = -1;
		let bestAt = -1;
		let bestTau = -Infinity;
		for (let t = 0; t < alive.length; t++) {
			const i = alive[t];
			const tau =
				ports.singular || ports.unknown[i]
					? NaN
					: ports.infinite[i]
						? Infinity
						: ports.d[i] * H[i * m + i];
			const key = Number.isNaN(tau) ? -Infinity : tau;
			if (best < 0 || key > bestTau) {
				best = i;
				bestAt = t;
				bestTau = key;
			}
		}
		const k = ports.elements[best];
		out.push({ element: net.elements[k].id, tau: Number.isFinite(bestTau) ? bestTau : null });
		held.add(k);
		const before = alive;
		alive = alive.filter((i) => i !== best);
		const pivot = H[best * m + best];
		let scale = Math.abs(pivot);
		let anyInfinite = false;
		for (const i of alive) {
			scale = Math.max(scale, Math.abs(H[i * m + i]));
			if (ports.infinite[i]) anyInfinite = true;
		}
		if (ports.singular || anyInfinite || ports.infinite[best] || ports.conflicts.length) {
			if (alive.length > 0) {
				ports = heldConfiguration(net, held);
				H = ports.H.slice();
				alive = ports.elements.map((_, i) => i);
				upper = symmetrize(H, ports.m);
			}
			continue;
		}
		// A zero pivot (a port that reads nothing) leaves the others unchanged when shorted.
		if (Math.abs(pivot) <= 1e-15 * scale) continue;
		if (upper) shortPortUpper(H, m, Int32Array.from(before), bestAt, pivot);
		else shortPort(H, m, Int32Array.from(alive), best, pivot);
	}
	return out;
}

/**
 * A reciprocal network's port matrix is symmetric in exact arithmetic (its solves leave
 * differences of ~1e-16 of its largest entry). When H is symmetric to 1e-12 of its largest
 * entry it is averaged once and from
 * then on only its upper triangle, in the order of the alive list (which removals keep), is
 * valid and updated: half the work of the general update. True when that applies.
 */
function symmetrize(H: Float64Array, m: number): boolean {
	let top = 0;
	for (let i = 0; i < m * m; i++) top = Math.max(top, Math.abs(H[i]));
	for (let i = 0; i < m; i++)
		for (let j = i + 1; j < m; j++)
			if (!(Math.abs(H[i * m + j] - H[j * m + i]) <= 1e-12 * top)) return false;
	for (let i = 0; i < m; i++)
		for (let j = i + 1; j < m; j++) H[i * m + j] = 0.5 * (H[i * m + j] + H[j * m + i]);
	return true;
}

/**
 * shortPort on the upper triangle: `order` is the alive list before the removal, `at` the
 * position of the shorted port in it. Row `best` of the symmetric matrix is gathered first
 * (entries before it in the order are stored in its column).
 */
function shortPortUpper(H: Float64Array, m: number, order: Int32Array, at: number, pivot: number) {
	const best = order[at];
	const count = order.length;
	const u = new Float64Array(count);
	for (let t = 0; t < count; t++) {
		const j = order[t];
		u[t] = t < at ? H[j * m + best] : H[best * m + j];
	}
	for (let a = 0; a < count; a++) {
		if (a === at) continue;
		const f = u[a] / pivot;
		if (f === 0) continue;
		const row = order[a] * m;
		for (let b = a; b < count; b++) {
			if (b === at) continue;
			H[row + order[b]] -= f * u[b];
		}
	}
}

/** The configuration rebuilt from the network with the held elements at their infinite value. */
function heldConfiguration(net: ResolvedNetwork, held: Set<number>): DcPorts {
	return dcPorts(net, (k) => {
		const isC = net.elements[k].type === 'C';
		if (held.has(k)) return isC ? 'short' : 'open';
		return isC ? 'iport' : 'vport';
	});
}

/**
 * H ← H − H[:,best]·H[best,:] / pivot on the rows and columns still alive. A function of its
 * own with typed arguments (V8 keeps its doubles unboxed; inside the long loop above they
 * were boxed while a closure shared its variables: 26 MB of garbage on a 300-port mesh).
 */
function shortPort(H: Float64Array, m: number, alive: Int32Array, best: number, pivot: number) {
	const count = alive.length;
	const rowBest = best * m;
	for (let a = 0; a < count; a++) {
		const row = alive[a] * m;
		const f = H[row + best] / pivot;
		if (f === 0) continue;
		for (let b = 0; b < count; b++) {
			const j = alive[b];
			H[row + j] -= f * H[rowBest + j];
		}
	}
}
