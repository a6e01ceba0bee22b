import type { Assembled } from './assemble';
import { polePencil, polish, zeroPencil, type Pencil } from './polish';
import type { PortModel } from './port-model';
import { poleMatrix, spectrum, vectorsFor, zeroMatrix, type Spectrum } from './spectrum';
import type { EigenPair } from './eigenvectors';

export interface Root {
	re: number;
	im: number;
	muRe: number;
	muIm: number;
	/** Index of the conjugate partner in the same list, or -1 for a real root. */
	partner: number;
	vectors: EigenPair | null;
}

/** Polishing every root costs one complex N×N factorization per step; above this size only the
 *  roots whose μ is small (the ones that lost digits) are polished, at most MAX_POLISHED. */
const POLISH_ALL_UP_TO = 120;
const MAX_POLISHED = 40;
const SMALL_MU = 1e-6;

function refine(sp: Spectrum, pen: Pencil, withVectors: boolean): Root[] {
	let maxMu = 0;
	for (const r of sp.s) maxMu = Math.max(maxMu, Math.hypot(r.muRe, r.muIm));
	const roots: Root[] = [];
	let polished = 0;
	const snap = 1e-11 * sp.s0;
	for (const r of sp.s) {
		if (r.im < 0) continue; // filled in from its partner below
		let { re, im } = r;
		const small = Math.hypot(r.muRe, r.muIm) < SMALL_MU * maxMu;
		if (pen.n <= POLISH_ALL_UP_TO || (small && polished < MAX_POLISHED)) {
			({ re, im } = polish(pen, re, im));
			polished++;
		}
		if (Math.hypot(re, im) < snap) {
			re = 0;
			im = 0;
		}
		const vectors = withVectors ? vectorsFor(sp, r.muRe, r.muIm) : null;
		roots.push({ re, im, muRe: r.muRe, muIm: r.muIm, partner: -1, vectors });
		if (r.im > 0) {
			const conj: Root = {
				re,
				im: -im,
				muRe: r.muRe,
				muIm: -r.muIm,
				partner: roots.length - 1,
				vectors: vectors && { xr: vectors.xr, xi: vectors.xi.map((v) => -v), yr: vectors.yr, yi: vectors.yi.map((v) => -v) }
			};
			roots[roots.length - 1].partner = roots.length;
			roots.push(conj);
		}
	}
	return roots;
}

/** Natural frequencies with their right/left eigenvectors in port (charge/flux) coordinates. */
export function computePoles(a: Assembled, pm: PortModel): { roots: Root[]; sp: Spectrum } {
	const sp = spectrum(poleMatrix(pm), pm.m, pm.s0);
	return { roots: refine(sp, polePencil(a), true), sp };
}

/** Transmission zeros; `null` when H(s0) = 0 so the reduction does not apply at this shift. */
export function computeZeros(a: Assembled, pm: PortModel): Root[] | null {
	let scale = Math.abs(pm.h0);
	for (let i = 0; i < pm.m; i++) scale = Math.max(scale, Math.abs(pm.g[i] * pm.h[i] * pm.d[i] * pm.s0));
	if (scale === 0 || Math.abs(pm.h0) <= 1e-13 * scale) return null;
	const sp = spectrum(zeroMatrix(pm), pm.m, pm.s0);
	return refine(sp, zeroPencil(a), false);
}
