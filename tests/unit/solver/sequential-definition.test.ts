// The sequential (largest-first) estimate against its own definition, computed the slow way:
// take the largest zero-value time constant, hold that element at its infinite value (capacitor
// shorted, inductor open), rebuild the configuration from the network and read every remaining
// τ afresh — one new factorization per step, no rank-one updates (common practice: the
// dominant-pole sequence of the time-constant method). The engine reaches the same sequence by
// Schur-complement updates of the port matrix, on one triangle when the matrix is symmetric.
import { describe, expect, test } from 'vitest';
import { dcPorts } from '../../../src/lib/solver/dc-ports';
import { groupReactivePorts } from '../../../src/lib/solver/reactive-ports';
import { openCircuitPorts } from '../../../src/lib/solver/time-constants';
import { sequentialTimeConstants } from '../../../src/lib/solver/sequential';
import { validateNetwork } from '../../../src/lib/solver/validate';
import type { ResolvedNetwork } from '../../../src/lib/solver/types';
import { randomNetwork, type NetworkClass } from './random-networks';

/** The sequence by definition: a fresh configuration per step. */
function byDefinition(net: ResolvedNetwork): { element: string; tau: number }[] {
	const held = new Set<number>();
	const out: { element: string; tau: number }[] = [];
	for (let step = 0; step < net.reactive.length; step++) {
		const ports = dcPorts(net, (k) => {
			const isC = net.elements[k].type === 'C';
			if (held.has(k)) return isC ? 'short' : 'open';
			return isC ? 'iport' : 'vport';
		});
		if (ports.m === 0) break;
		let best = -1;
		let tau = -Infinity;
		for (let i = 0; i < ports.m; i++) {
			const t = ports.infinite[i] ? Infinity : ports.d[i] * ports.H[i * ports.m + i];
			if (best < 0 || t > tau) [best, tau] = [i, t];
		}
		out.push({ element: net.elements[ports.elements[best]].id, tau });
		held.add(ports.elements[best]);
	}
	return out;
}

describe('sequential estimate: rank-one updates against a fresh configuration per step', () => {
	const classes: NetworkClass[] = ['rc', 'rc-floating', 'rlc'];
	test('random RC, floating RC and RLC networks: every step above 1e-9 of the first agrees to 1e-9', () => {
		const problems: string[] = [];
		let compared = 0;
		for (let seed = 1; seed <= 45; seed++) {
			const kind = classes[seed % 3];
			const net = groupReactivePorts(
				validateNetwork(randomNetwork(kind, 14 + (seed % 30), seed))
			).net;
			const oc = openCircuitPorts(net);
			if (oc.singular || oc.conflicts.length) continue;
			const fast = sequentialTimeConstants(net, oc);
			const slow = byDefinition(net);
			const top = Math.max(...slow.map((s) => (Number.isFinite(s.tau) ? Math.abs(s.tau) : 0)));
			for (let i = 0; i < slow.length; i++) {
				const want = slow[i];
				if (!(Math.abs(want.tau) > 1e-9 * top)) break; // the rest is rounding (loops of shorts)
				const got = fast[i];
				const wantTau = Number.isFinite(want.tau) ? want.tau : null;
				const close =
					wantTau === null
						? got.tau === null
						: got.tau !== null && Math.abs(got.tau - wantTau) <= 1e-9 * Math.abs(wantTau);
				// Equal τ (a tie) may be taken in either order; the values must still agree.
				const tie = i + 1 < slow.length && Math.abs(slow[i + 1].tau - want.tau) <= 1e-9 * top;
				if (!close || (!tie && got.element !== want.element))
					problems.push(
						`${kind} #${seed} step ${i + 1}: ${got.element} ${got.tau} vs ${want.element} ${want.tau}`
					);
				compared++;
			}
		}
		expect(problems, problems.slice(0, 8).join('\n')).toEqual([]);
		expect(compared).toBeGreaterThan(200);
	});
});
