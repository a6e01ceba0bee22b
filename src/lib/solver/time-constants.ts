import { dcPorts, type DcPorts } from './dc-ports';
import type { ResolvedNetwork, TimeConstant } from './types';

/** Zero-value configuration: every capacitor open, every inductor shorted; all are ports. */
export function openCircuitPorts(net: ResolvedNetwork): DcPorts {
	return dcPorts(net, (k) => (net.elements[k].type === 'C' ? 'iport' : 'vport'));
}

/** Infinite-value configuration: every capacitor shorted, every inductor open; all are ports. */
export function shortCircuitPorts(net: ResolvedNetwork): DcPorts {
	return dcPorts(net, (k) => (net.elements[k].type === 'C' ? 'vport' : 'iport'));
}

const finite = (x: number) => (Number.isFinite(x) ? x : null);

/**
 * Open-circuit (zero-value) time constants. A capacitor port reads volts per ampere (R seen);
 * an inductor port reads the branch current per volt, which is −1/R seen. With d = C or −L,
 * τ = d·Hkk in both cases, and Σ τ is the trace of the time-constant matrix.
 */
export function openCircuitTimeConstants(net: ResolvedNetwork, oc: DcPorts): TimeConstant[] {
	return oc.elements.map((k, i) => {
		const e = net.elements[k];
		const hkk = oc.H[i * oc.m + i];
		if (oc.singular) return { element: e.id, resistance: null, tau: null };
		if (e.type === 'C') {
			return oc.infinite[i]
				? { element: e.id, resistance: null, tau: null }
				: { element: e.id, resistance: hkk, tau: e.value * hkk };
		}
		// Inductor: an infinite reading is an infinite current — zero resistance, infinite τ.
		if (oc.infinite[i]) return { element: e.id, resistance: 0, tau: null };
		return { element: e.id, resistance: finite(-1 / hkk), tau: -e.value * hkk + 0 };
	});
}

/**
 * Short-circuit (infinite-value) time constants: the capacitor port is now a voltage port
 * (reading −1/R), the inductor port a current port (reading R); τ = −d / Kkk in both cases.
 */
export function shortCircuitTimeConstants(net: ResolvedNetwork, sc: DcPorts): TimeConstant[] {
	return sc.elements.map((k, i) => {
		const e = net.elements[k];
		const kkk = sc.H[i * sc.m + i];
		if (sc.singular) return { element: e.id, resistance: null, tau: null };
		if (e.type === 'C') {
			if (sc.infinite[i]) return { element: e.id, resistance: 0, tau: 0 };
			const r = finite(-1 / kkk);
			return { element: e.id, resistance: r, tau: r === null ? null : e.value * r };
		}
		if (sc.infinite[i]) return { element: e.id, resistance: null, tau: 0 };
		return { element: e.id, resistance: kkk, tau: finite(e.value / kkk) };
	});
}
