import { ratio, solveAt, type DirectSystem } from './direct-solve';
import type { Sweep } from './direct-response';
import { evalPz, type PzForm } from './frequency-response';

/** Largest relative difference between the pole–zero form and the network equations allowed. */
export const AGREE = 1e-6;

/**
 * The worst relative difference |H_pz − H|/|H| over a sweep of the network equations, with the
 * frequency where it occurs (null when there is nothing to compare). Computed from the
 * logarithms, so a response of −5000 dB compares as well as one of 0 dB. A pole–zero form that
 * is missing (H ≡ 0 reported) against a non-zero solve counts as a difference of 1.
 */
export function disagreement(pz: PzForm | null, s: Sweep): { size: number; f: number } | null {
	let worst: { size: number; f: number } | null = null;
	// Every other point: a hundred frequencies spanning every pole and zero are plenty.
	for (let i = 0; i < s.f.length; i += 2) {
		if (!s.ok[i]) continue;
		const w = 2 * Math.PI * s.f[i];
		const direct = s.logMag[i];
		let size: number;
		if (!pz) size = direct === -Infinity ? 0 : 1;
		else if (direct === -Infinity) size = 1;
		else {
			const v = evalPz(pz, w);
			const dl = v.logMag - direct;
			const da = v.arg - s.arg[i];
			// |e^{dl + j·da} − 1|, exact for small differences and saturating for large ones.
			const half = Math.sin(da / 2);
			size =
				dl > 30
					? Infinity
					: Math.hypot(
							Math.expm1(dl) * Math.cos(da) - 2 * half * half,
							Math.exp(dl) * Math.sin(da)
						);
		}
		if (Number.isNaN(size)) size = Infinity;
		if (!worst || size > worst.size) worst = { size, f: s.f[i] };
	}
	return worst;
}

/**
 * Zeros at s = 0: near the origin H ≈ K·s^(z₀ − p₀), so s·H′/H → z₀ − p₀; read at a real s a
 * million times below the smallest non-zero pole and rounded.
 */
export function zerosAtOrigin(sys: DirectSystem, poles: { re: number; im: number }[]): number {
	const mags = poles.map((p) => Math.hypot(p.re, p.im)).filter((m) => m > 0);
	const p0 = poles.length - mags.length;
	const s = 1e-6 * (mags.length ? Math.min(...mags) : 1);
	const v = solveAt(sys, s, 0, true);
	if (!v?.dh || (v.h.re === 0 && v.h.im === 0)) return 0;
	const k = Math.round(s * ratio(v.dh, v.h).re);
	return Math.max(0, k + p0);
}
