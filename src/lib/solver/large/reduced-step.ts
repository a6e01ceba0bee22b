import { hessenberg, hqr } from '../eigen';
import { eigenvectors } from '../eigenvectors';
import { luFactor, luSolve } from '../lu';
import { evalModal, modalForm, type Modal } from '../modal';
import type { Root } from '../poles';
import type { PortModel } from '../port-model';
import { INFINITE_MU } from '../spectrum';
import type { ReducedModel, Sweep } from './response-large';

/**
 * The pole–residue form of a reduced model (Gr + s·Cr)·x = br, y = lrᵀ·x — the same
 * shift-and-invert reduction the dense path uses (port-model.ts), with the model's q unknowns in
 * the place of the ports: M = (Gr + s0·Cr)⁻¹·Cr, poles s0 − 1/μ, residues from the eigenvectors
 * (modal.ts). The step response then comes from step-response.ts exactly as for small networks.
 */
export function reducedModal(model: ReducedModel): Modal | null {
	const m = model.q;
	if (m === 0) return null;
	const k = new Float64Array(m * m);
	for (let i = 0; i < m * m; i++) k[i] = model.gr[i] + model.s0 * model.cr[i];
	const f = luFactor(k, m);
	if (!(f.pivotRatio > 1e-14)) return null;
	const M = new Float64Array(m * m);
	const col = new Float64Array(m);
	for (let j = 0; j < m; j++) {
		for (let i = 0; i < m; i++) col[i] = model.cr[i * m + j];
		luSolve(f, col);
		for (let i = 0; i < m; i++) M[i * m + j] = col[i];
	}
	const h = luSolve(f, model.br.slice());
	let h0 = 0;
	for (let i = 0; i < m; i++) h0 += model.lr[i] * h[i];
	const hs = hessenberg(M, m, true);
	const ev = hqr(hs);
	let max = 0;
	for (let i = 0; i < m; i++) max = Math.max(max, Math.hypot(ev.re[i], ev.im[i]));
	const roots: Root[] = [];
	for (let i = 0; i < m; i++) {
		const a = ev.re[i];
		const b = ev.im[i];
		const r2 = a * a + b * b;
		if (!(Math.sqrt(r2) > INFINITE_MU * max)) continue;
		roots.push({
			re: model.s0 - a / r2,
			im: b / r2,
			muRe: a,
			muIm: b,
			partner: -1,
			vectors: eigenvectors(hs, a, b)
		});
	}
	// The port form H = h0 − σ·g·(I + σM)⁻¹·(D·h) of modal.ts matches
	// lrᵀ·(I + σM)⁻¹·h = lrᵀ·h − σ·lrᵀ·(I + σM)⁻¹·M·h with g = lr, D = I and M·h in the place of h.
	const mh = new Float64Array(m);
	for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) mh[i] += M[i * m + j] * h[j];
	const pm = {
		m,
		s0: model.s0,
		g: model.lr,
		gz: new Float64Array(m),
		h: mh,
		h0,
		hz0: 0,
		d: new Float64Array(m).fill(1)
	} as unknown as PortModel;
	return modalForm(pm, roots, 'transfer');
}

/**
 * Largest miss of the reduced model against the direct solves, at `count` points of the sweep
 * spread over it, relative to the largest |H| of the sweep (so a deep notch does not count as a
 * large relative error of nothing).
 */
export function reducedModelError(md: Modal, sw: Sweep, count = 7): number {
	let scale = 0;
	for (const v of sw.h) if (Number.isFinite(v.re)) scale = Math.max(scale, Math.hypot(v.re, v.im));
	if (!(scale > 0)) return 0;
	let worst = 0;
	for (let t = 0; t < count; t++) {
		const i = Math.round(((sw.f.length - 1) * t) / Math.max(1, count - 1));
		const ref = sw.h[i];
		if (!Number.isFinite(ref.re)) continue;
		const v = evalModal(md, 0, 2 * Math.PI * sw.f[i]);
		worst = Math.max(worst, Math.hypot(v.re - ref.re, v.im - ref.im) / scale);
	}
	return worst;
}
