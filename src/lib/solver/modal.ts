import type { Root } from './poles';
import type { PortModel } from './port-model';

/**
 * Pole–residue form of the transfer from the shifted port model:
 *   H(s) = h0 − σ g (I + σM)⁻¹ D h,  M = D·H,  σ = s − s0,
 * and with M x_i = μ_i x_i, yᵢᵀM = μ_i yᵢᵀ, each mode contributes c_i/(1 + σμ_i), where
 * c_i = (g·x_i)(y_i·Dh)/(y_i·x_i). Since 1 + σμ_i = μ_i (s − p_i):
 *   H(s) = D∞ + Σ r_i / (s − p_i),  r_i = c_i / μ_i²,  D∞ = h0 − Σ c_i / μ_i.
 * `out` picks the output functional: the transfer (g, h0) or the input impedance (gz, hz0).
 */
export interface Modal {
	direct: number;
	poles: { re: number; im: number; rr: number; ri: number }[];
}

export function modalForm(pm: PortModel, roots: Root[], out: 'transfer' | 'zin'): Modal {
	const g = out === 'transfer' ? pm.g : pm.gz;
	const h0 = out === 'transfer' ? pm.h0 : pm.hz0;
	let dr = h0;
	let di = 0;
	const poles: Modal['poles'] = [];
	for (const r of roots) {
		const v = r.vectors;
		if (!v) continue;
		let ar = 0,
			ai = 0,
			br = 0,
			bi = 0,
			gr = 0,
			gi = 0;
		for (let k = 0; k < pm.m; k++) {
			ar += g[k] * v.xr[k];
			ai += g[k] * v.xi[k];
			const dh = pm.d[k] * pm.h[k];
			br += v.yr[k] * dh;
			bi += v.yi[k] * dh;
			gr += v.yr[k] * v.xr[k] - v.yi[k] * v.xi[k];
			gi += v.yr[k] * v.xi[k] + v.yi[k] * v.xr[k];
		}
		// c = a·b / γ
		const nr = ar * br - ai * bi;
		const ni = ar * bi + ai * br;
		const g2 = gr * gr + gi * gi;
		const cr = (nr * gr + ni * gi) / g2;
		const ci = (ni * gr - nr * gi) / g2;
		// c/μ and c/μ²
		const m2 = r.muRe * r.muRe + r.muIm * r.muIm;
		const qr = (cr * r.muRe + ci * r.muIm) / m2;
		const qi = (ci * r.muRe - cr * r.muIm) / m2;
		dr -= qr;
		di -= qi;
		const rr = (qr * r.muRe + qi * r.muIm) / m2;
		const ri = (qi * r.muRe - qr * r.muIm) / m2;
		poles.push({ re: r.re, im: r.im, rr, ri });
	}
	void di; // the imaginary part of D∞ is round-off for a real network
	return { direct: dr, poles };
}

/** H(jω) from the modal form, O(#poles) per frequency. */
export function evalModal(md: Modal, sr: number, si: number): { re: number; im: number } {
	let re = md.direct;
	let im = 0;
	for (const p of md.poles) {
		const ar = sr - p.re;
		const ai = si - p.im;
		const a2 = ar * ar + ai * ai;
		re += (p.rr * ar + p.ri * ai) / a2;
		im += (p.ri * ar - p.rr * ai) / a2;
	}
	return { re, im };
}

/**
 * Relative degree r of H (finite poles minus finite zeros), from the expansion at infinity:
 * H(s) = D∞ + Σ_k m_k / s^{k+1} with Markov parameters m_k = Σ r_i p_i^k. r = 0 when D∞ ≠ 0,
 * else the first k with m_k ≠ 0 gives r = k + 1. "≠ 0" is judged against the size of the
 * terms that cancel (`tol` of Σ|r_i p_i^k|), with powers scaled by max|p| so nothing overflows.
 *
 * The zero problem needs this count: for r ≥ 2 the infinite zeros form a nilpotent block whose
 * rounded eigenvalues come out near ε^{1/r}·‖M‖, far above any fixed threshold.
 */
export function relativeDegree(md: Modal, h0: number, tol = 1e-8): number {
	const n = md.poles.length;
	let noise = Math.abs(h0);
	for (const p of md.poles)
		noise += Math.hypot(p.rr, p.ri) / Math.max(Math.hypot(p.re, p.im), 1e-300);
	if (Math.abs(md.direct) > tol * noise) return 0;
	const P = Math.max(...md.poles.map((p) => Math.hypot(p.re, p.im)), 1e-300);
	// Running powers (p/P)^k · r for each pole.
	const wr = md.poles.map((p) => p.rr);
	const wi = md.poles.map((p) => p.ri);
	for (let k = 0; k < n; k++) {
		let sr = 0;
		let si = 0;
		let mag = 0;
		for (let i = 0; i < n; i++) {
			sr += wr[i];
			si += wi[i];
			mag += wi[i] === 0 ? Math.abs(wr[i]) : Math.hypot(wr[i], wi[i]);
		}
		if (mag > 0 && Math.hypot(sr, si) > tol * mag) return k + 1;
		for (let i = 0; i < n; i++) {
			const a = md.poles[i].re / P;
			const b = md.poles[i].im / P;
			[wr[i], wi[i]] = [wr[i] * a - wi[i] * b, wr[i] * b + wi[i] * a];
		}
	}
	return n;
}
