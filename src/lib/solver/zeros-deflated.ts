import type { PortModel } from './port-model';
import { dot, spectrum, type Spectrum } from './spectrum';

/**
 * The zero matrix Z = D·(H − h gᵀ/h0) in the eigenbasis of the pole problem (symmetric path):
 * with S = D^½·H·D^½ = V Λ Vᵀ (V orthogonal, m×m), D^-½·Z·D^½ = S − u wᵀ (u = D^½h/h0,
 * w = D^½g), so
 *     Vᵀ·(D^-½ Z D^½)·V = Λ − a bᵀ,   a = Vᵀu, b = Vᵀw,
 * a similarity, hence the same eigenvalues. The k modes with μ ≈ 0 (capacitor loops: poles at
 * infinity) form a block that is zero to within ε·‖S‖. The characteristic polynomial of a
 * diagonal-plus-rank-one matrix,
 *     det(λI − Λ + a bᵀ) = Π(λ − λ_i) · (1 + Σ a_i b_i / (λ − λ_i)),
 * depends on a and b only through the products a_i b_i, and on the infinite block, where every
 * λ_i = 0, only through their sum c = Σ_inf a_i b_i. So that block collapses to one row and
 * column carrying c (k − 1 exact zeros split off: infinite zeros), and the problem keeps
 * m − k + 1 unknowns instead of m: a mesh whose loops leave half its ports without a finite pole
 * costs an eighth of the general QR.
 *
 * The pole basis need not hold the infinite block's vectors (node-space-spectrum.ts keeps only
 * those of range(S)): c = Σ_inf a_i b_i is the inner product of u and w restricted to the
 * infinite directions, read off y = Qᵀu and Qᵀw (SymmetricBasis) on the coordinates where S is
 * known to vanish, plus the products of the basis' own near-zero modes.
 *
 * Null when there is nothing to deflate (the caller solves the full zero matrix instead).
 */
export function deflatedZeroSpectrum(pm: PortModel, poles: Spectrum): Spectrum | null {
	const basis = poles.basis;
	if (!basis) return null;
	const m = pm.m;
	const { values, vectors, sqrtD } = basis;
	const finite = values.length;
	if (m - finite < 2) return null;
	const u = new Float64Array(m);
	const w = new Float64Array(m);
	for (let i = 0; i < m; i++) {
		u[i] = (sqrtD[i] * pm.h[i]) / pm.h0;
		w[i] = sqrtD[i] * pm.g[i];
	}
	// a and b in port coordinates, where a fast mode's vector and the small entries of u and w
	// (small capacitors) meet term by term: their products keep their relative accuracy.
	const keep = finite + 1;
	const ra = new Float64Array(keep);
	const rb = new Float64Array(keep);
	const diag = new Float64Array(keep);
	for (let k = 0; k < finite; k++) {
		ra[k] = dot(vectors, k * m, u);
		rb[k] = dot(vectors, k * m, w);
		diag[k] = values[k];
	}
	// Any split of c into ra·rb gives the same eigenvalues; equal magnitudes keep the row and the
	// column of the collapsed block on one scale.
	const c = basis.infiniteProduct(u, w);
	ra[keep - 1] = Math.sign(c) * Math.sqrt(Math.abs(c));
	rb[keep - 1] = Math.sqrt(Math.abs(c));
	const Z = new Float64Array(keep * keep);
	for (let i = 0; i < keep; i++) {
		for (let j = 0; j < keep; j++) Z[i * keep + j] = -ra[i] * rb[j];
		Z[i * keep + i] += diag[i];
	}
	const sp = spectrum(Z, keep, pm.s0, false);
	// Report the deflated μ = 0 too, so counts match the full problem.
	const mu = {
		re: Float64Array.from([...sp.mu.re, ...new Array(m - keep).fill(0)]),
		im: Float64Array.from([...sp.mu.im, ...new Array(m - keep).fill(0)])
	};
	return { ...sp, mu };
}
