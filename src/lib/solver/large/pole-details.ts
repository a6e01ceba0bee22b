import { dot, type Port } from '../assemble';
import { multiplyValues } from '../kernels/csc';
import type { Complex, ResolvedNetwork } from '../types';
import type { GeneralPole } from './dominant-general';
import type { RcPole } from './dominant-rc';
import type { NodalRC } from './rc-nodal';
import type { SparseMna } from './sparse-mna';

export interface PoleDetail {
	re: number;
	im: number;
	owners: { element: string; share: number }[];
	residue: Complex | null;
	backwardError: number;
}

const SHARE_FLOOR = 1e-6;
const MAX_OWNERS = 12;

/** The largest shares (at most MAX_OWNERS, each at least SHARE_FLOOR of the total), by element. */
function ranked(net: ResolvedNetwork, elements: ArrayLike<number>, shares: Float64Array) {
	let total = 0;
	for (let i = 0; i < shares.length; i++) total += shares[i];
	if (!(total > 0) || !Number.isFinite(total)) return [];
	// Partial selection: keep a short sorted list instead of sorting every element's share.
	const top: number[] = [];
	for (let i = 0; i < shares.length; i++) {
		const v = shares[i];
		if (v < SHARE_FLOOR * total) continue;
		if (top.length === MAX_OWNERS && v <= shares[top[top.length - 1]]) continue;
		let j = top.length;
		if (j === MAX_OWNERS) j--;
		while (j > 0 && shares[top[j - 1]] < v) {
			top[j] = top[j - 1];
			j--;
		}
		top[j] = i;
	}
	return top.map((i) => ({ element: net.elements[elements[i]].id, share: shares[i] / total }));
}

/**
 * RC path. Ownership: capacitor k's share of the mode's stored energy, C_k·u_k² / Σ C_j·u_j²
 * (u_k the mode's voltage across it) — exactly the participation factor x_k·y_k the dense path
 * reports (for the symmetric pencil the left and right vectors coincide: docs/methods.md §7),
 * listed for the largest owners (at most 12). Residue of the transfer at p:
 * (outᵀ·v)(vᵀ·b(p)) / (vᵀ·C·v), with b(s) = rhsG + s·rhsC and vᵀ·C·v = 1.
 */
export function rcPoleDetail(net: ResolvedNetwork, rc: NodalRC, p: RcPole): PoleDetail {
	const v = p.vector;
	const at = (i: number) => (i >= 0 ? v[i] : 0);
	const { element, a, b } = rc.caps;
	const shares = new Float64Array(element.length);
	for (let i = 0; i < element.length; i++) {
		const u = at(a[i]) - at(b[i]);
		shares[i] = net.elements[element[i]].value * u * u;
	}
	const out = at(rc.out.plus) - at(rc.out.minus);
	let vb = 0;
	for (let i = 0; i < rc.n; i++) vb += v[i] * (rc.rhsG[i] + p.re * rc.rhsC[i]);
	return {
		re: p.re,
		im: 0,
		owners: ranked(net, element, shares),
		residue: { re: out * vb, im: 0 },
		backwardError: p.backwardError
	};
}

/**
 * General path. Ownership |d_k·(p_kᵀv)(p_kᵀw)| normalized (the participation factors of the
 * dense path, with the pencil's right and left vectors); residue (outᵀv)(wᵀb) / (wᵀCv).
 */
export function generalPoleDetail(
	net: ResolvedNetwork,
	mna: SparseMna,
	p: GeneralPole
): PoleDetail {
	const elements = mna.ports.map((port) => port.element);
	const shares = new Float64Array(elements.length);
	mna.ports.forEach((port: Port, i) => {
		const [xr, xi] = [dot(port.vec, p.vr), dot(port.vec, p.vi)];
		const [yr, yi] = [dot(port.vec, p.wr), dot(port.vec, p.wi)];
		shares[i] = Math.abs(port.d) * Math.hypot(xr * yr - xi * yi, xr * yi + xi * yr);
	});
	const n = mna.size;
	const cvr = multiplyValues(mna.pattern, mna.c, p.vr, new Float64Array(n));
	const cvi = multiplyValues(mna.pattern, mna.c, p.vi, new Float64Array(n));
	const cdot = (a: Float64Array, b: Float64Array) => {
		let s = 0;
		for (let i = 0; i < n; i++) s += a[i] * b[i];
		return s;
	};
	// wᵀCv (no conjugation: the left vector of the pencil).
	const dr = cdot(p.wr, cvr) - cdot(p.wi, cvi);
	const di = cdot(p.wr, cvi) + cdot(p.wi, cvr);
	const [or, oi] = [dot(mna.out, p.vr), dot(mna.out, p.vi)];
	const [br, bi] = [dot(mna.b, p.wr), dot(mna.b, p.wi)];
	const nr = or * br - oi * bi;
	const ni = or * bi + oi * br;
	const d2 = dr * dr + di * di;
	const residue = d2 > 0 ? { re: (nr * dr + ni * di) / d2, im: (ni * dr - nr * di) / d2 } : null;
	return {
		re: p.re,
		im: p.im,
		owners: ranked(net, elements, shares),
		residue: residue && Number.isFinite(residue.re) && Number.isFinite(residue.im) ? residue : null,
		backwardError: p.backwardError
	};
}
