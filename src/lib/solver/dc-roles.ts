import { GROUND, type ResolvedElement, type ResolvedNetwork } from './types';

/**
 * What each element is in the DC configurations of the time constants, for the structural
 * shortcuts of dc-ports.ts (which readings are exactly 0 or ∞, which shorts are redundant).
 *
 * - `short`: fixes a zero voltage between its terminals (a zeroed V source, or a VCVS whose
 *   control is its own output: v = k·v forces v = 0 for k ≠ 1);
 * - `ideal`: an ideal voltage output whose value depends on the rest of the network (VCVS, CCVS,
 *   op-amp output): shorting it is an inconsistent configuration, not a zero resistance;
 * - `conductor`: carries a current set by its own voltage: R, a VCCS whose control is its own
 *   terminals (conductance g), a CCVS whose control is its own branch current through a sensor
 *   in series (resistance ±k) — the resistance it represents, neither a short nor an open;
 * - `none`: carries no DC current of its own (C, I, a CCCS or any other current output).
 *
 * Only the structure uses these roles; the equations always use the element's own stamp.
 */
export type DcRole = 'short' | 'ideal' | 'conductor' | 'none';

/** Branch terminals of the current-carrying part (the op-amp's output is out→gnd). */
function carrier(e: ResolvedElement): [number, number] | null {
	if (e.type === 'OPAMP') return [e.nodes[2], GROUND];
	if (e.type === 'C' || e.type === 'L') return null;
	return [e.nodes[0], e.nodes[1]];
}

/**
 * +1 / −1 when sensor `s` (a V element) is in series with the branch [a, b] of element `e` —
 * they share a node that no other branch touches — with the sign of the sensor's current
 * relative to e's branch current a→b; 0 when not in series.
 */
function seriesSign(
	net: ResolvedNetwork,
	touches: Int32Array,
	e: ResolvedElement,
	s: ResolvedElement
): number {
	const [a, b] = [e.nodes[0], e.nodes[1]];
	const [p, q] = [s.nodes[0], s.nodes[1]];
	const only = (x: number) => x !== GROUND && touches[x] === 2;
	if ((b === p || a === q) && only(b === p ? b : a)) return 1;
	if ((b === q || a === p) && only(b === q ? b : a)) return -1;
	return 0;
}

export function dcRoles(net: ResolvedNetwork): DcRole[] {
	const touches = new Int32Array(net.nodeNames.length);
	for (const e of net.elements) {
		// Reactive elements carry current too (as ports or shorts); count every branch.
		const br =
			e.type === 'C' || e.type === 'L'
				? ([e.nodes[0], e.nodes[1]] as [number, number])
				: carrier(e);
		if (!br) continue;
		for (const x of br) if (x !== GROUND) touches[x]++;
	}
	return net.elements.map((e): DcRole => {
		const [a, b, cp, cn] = e.nodes;
		const ownControl = cp === a && cn === b ? 1 : cp === b && cn === a ? -1 : 0;
		switch (e.type) {
			case 'R':
				return 'conductor';
			case 'V':
				return 'short';
			case 'OPAMP':
				return 'ideal';
			case 'VCVS':
				return ownControl !== 0 && e.value * ownControl !== 1 ? 'short' : 'ideal';
			case 'VCCS':
				return ownControl !== 0 && e.value !== 0 ? 'conductor' : 'none';
			case 'CCVS': {
				const sign = seriesSign(net, touches, e, net.elements[e.control]);
				if (sign === 0) return 'ideal';
				return e.value === 0 ? 'short' : 'conductor';
			}
			default:
				return 'none';
		}
	});
}

/** [a, b] of the branch a role puts between two nodes (null for `none`). */
export function roleBranch(e: ResolvedElement): [number, number] | null {
	return carrier(e);
}
