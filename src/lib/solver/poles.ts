import type { Assembled } from './assemble';
import { polePencil, polish, zeroPencil, type Pencil } from './polish';
import type { PortModel } from './port-model';
import {
	poleMatrix,
	spectrum,
	symmetricSpectrum,
	vectorsFor,
	zeroMatrix,
	type Spectrum
} from './spectrum';
import type { EigenPair } from './eigenvectors';
import { deflatedZeroSpectrum } from './zeros-deflated';
import { nodeSpaceSpectrum } from './node-space-spectrum';

export interface Root {
	re: number;
	im: number;
	muRe: number;
	muIm: number;
	/** Index of the conjugate partner in the same list, or -1 for a real root. */
	partner: number;
	vectors: EigenPair | null;
}

/**
 * Polishing costs a complex N×N factorization per step, so only the roots that may have lost
 * digits are polished. The QR iteration leaves an absolute error of about ε·max|μ| in μ, hence
 * |δs|/|s| ≈ ε·max|μ| / (|μ|²·|s|); roots where that exceeds POLISH_ABOVE are refined, at most
 * MAX_POLISHED of them, worst first. With the shift in the middle of the spectrum this only
 * happens beyond about nine decades of spread.
 */
const MAX_POLISHED = 40;
const POLISH_ABOVE = 1e-11;
/** |Re s| / |Im s| below which a root counts as on the jω axis (a Q above 5e11). */
const ON_AXIS = 1e-12;

function refine(sp: Spectrum, pencil: () => Pencil, withVectors: boolean): Root[] {
	let maxMu = 0;
	for (const r of sp.s) maxMu = Math.max(maxMu, Math.hypot(r.muRe, r.muIm));
	const roots: Root[] = [];
	const snap = 1e-11 * sp.s0;
	const risk = sp.s.map((r) => {
		const m2 = r.muRe * r.muRe + r.muIm * r.muIm;
		return (Number.EPSILON * maxMu) / (m2 * Math.max(Math.hypot(r.re, r.im), 1e-300));
	});
	const chosen = new Set(
		sp.s
			.map((_, i) => i)
			.filter((i) => risk[i] > POLISH_ABOVE && sp.s[i].im >= 0)
			.sort((i, j) => risk[j] - risk[i])
			.slice(0, MAX_POLISHED)
	);
	// The dense pencil copy is only built when some root needs it.
	let pen: Pencil | null = null;
	for (const [idx, r] of sp.s.entries()) {
		if (r.im < 0) continue; // filled in from its partner below
		let { re, im } = r;
		if (chosen.has(idx)) ({ re, im } = polish((pen ??= pencil()), re, im));
		if (Math.hypot(re, im) < snap) {
			re = 0;
			im = 0;
		}
		// On the jω axis to within rounding (a lossless LC tank): exactly on it, so Q and τ read
		// as infinite (null) rather than as a 1e13 stand-in, and no "unstable" warning is raised.
		if (im !== 0 && Math.abs(re) <= ON_AXIS * Math.abs(im)) re = 0;
		const vectors = withVectors ? (r.vectors ?? vectorsFor(sp, r.muRe, r.muIm)) : null;
		roots.push({ re, im, muRe: r.muRe, muIm: r.muIm, partner: -1, vectors });
		if (r.im > 0) {
			const conj: Root = {
				re,
				im: -im,
				muRe: r.muRe,
				muIm: -r.muIm,
				partner: roots.length - 1,
				vectors: vectors && {
					xr: vectors.xr,
					xi: vectors.xi.map((v) => -v),
					yr: vectors.yr,
					yi: vectors.yi.map((v) => -v)
				}
			};
			roots[roots.length - 1].partner = roots.length;
			roots.push(conj);
		}
	}
	return roots;
}

/** Natural frequencies with their right/left eigenvectors in port (charge/flux) coordinates. */
export function computePoles(
	a: Assembled,
	pm: PortModel,
	route: PoleRoute = 'auto'
): { roots: Root[]; sp: Spectrum } {
	const symmetric = route !== 'general' && isReciprocal(a);
	const sp =
		(symmetric && route === 'auto' ? nodeSpaceSpectrum(a, pm) : null) ??
		(symmetric ? symmetricSpectrum(pm) : null) ??
		spectrum(poleMatrix(pm), pm.m, pm.s0);
	return { roots: refine(sp, () => polePencil(a), true), sp };
}

/**
 * 'auto': for a reciprocal RC network the symmetric problem on the nodes when the capacitor loops
 * make it smaller (node-space-spectrum.ts), else on the ports (spectrum.ts); otherwise the
 * general one. 'ports' and 'general' force those, for comparisons.
 */
export type PoleRoute = 'auto' | 'ports' | 'general';

/**
 * Transmission zeros; `null` when H(s0) = 0 so the reduction does not apply at this shift.
 * `poles`: the pole spectrum at the same shift, whose symmetric basis lets the infinite modes be
 * deflated first (zeros-deflated.ts).
 */
export function computeZeros(a: Assembled, pm: PortModel, poles?: Spectrum): Root[] | null {
	if (!zerosReducible(pm)) return null;
	const deflated = poles && poles.s0 === pm.s0 ? deflatedZeroSpectrum(pm, poles) : null;
	const sp = deflated ?? spectrum(zeroMatrix(pm), pm.m, pm.s0, false);
	return refine(sp, () => zeroPencil(a), false);
}

/**
 * Modified nodal equations are symmetric when the network is reciprocal (no controlled source or
 * op-amp; V sources and branches stamp symmetrically): then H = Pᵀ(G + s0·C)⁻¹P is symmetric
 * and, with every d > 0 (capacitors), the symmetric eigen path applies (spectrum.ts).
 */
function isReciprocal(a: Assembled): boolean {
	const n = a.size;
	for (let i = 0; i < n; i++)
		for (let j = i + 1; j < n; j++) if (a.g[i * n + j] !== a.g[j * n + i]) return false;
	return true;
}

/** Whether H(s0) is clearly non-zero, so the zero matrix D·(H − h g / h0) exists at this shift. */
export function zerosReducible(pm: PortModel): boolean {
	let scale = Math.abs(pm.h0);
	for (let i = 0; i < pm.m; i++)
		scale = Math.max(scale, Math.abs(pm.g[i] * pm.h[i] * pm.d[i] * pm.s0));
	return scale !== 0 && Math.abs(pm.h0) > 1e-13 * scale;
}
