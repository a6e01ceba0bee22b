import type { DcPorts } from './dc-ports';
import type { ResolvedNetwork } from './types';

/**
 * The input functional is the current the V input delivers (Zin = 1/I) or the voltage across
 * the I input (Zin = V). `value` is that functional's reading for a unit input.
 */
export function impedanceFromReading(
	net: ResolvedNetwork,
	re: number,
	im: number
): { re: number; im: number } | null {
	if (net.elements[net.input].type === 'V') {
		const d = re * re + im * im;
		// No current drawn: the source looks into an open circuit.
		if (!(d > 0) || !Number.isFinite(d)) return null;
		const z = { re: re / d, im: -im / d };
		return Number.isFinite(z.re) && Number.isFinite(z.im) ? z : null;
	}
	return Number.isFinite(re) && Number.isFinite(im) ? { re, im } : null;
}

/** Input impedance at DC from the zero-value (C open, L shorted) configuration. */
export function dcInputImpedance(net: ResolvedNetwork, oc: DcPorts, poleAtZero: boolean) {
	if (oc.singular || poleAtZero) return null;
	// An anchored floating component cannot change what the input sees (no current crosses).
	return impedanceFromReading(net, oc.hz0, 0);
}
