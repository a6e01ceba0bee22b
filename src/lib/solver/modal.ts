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
		let ar = 0, ai = 0, br = 0, bi = 0, gr = 0, gi = 0;
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
