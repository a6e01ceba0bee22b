import type { PortModel } from './port-model';
import { INFINITE_MU, spectrum, type Spectrum } from './spectrum';

/**
 * The zero matrix Z = D·(H − h gᵀ/h0) in the eigenbasis of the pole problem (symmetric path):
 * with S = D^½·H·D^½ = V Λ Vᵀ, D^-½·Z·D^½ = S − u wᵀ (u = D^½h/h0, w = D^½g), so
 *     Vᵀ·(D^-½ Z D^½)·V = Λ − a bᵀ,   a = Vᵀu, b = Vᵀw,
 * a similarity, hence the same eigenvalues. The k modes with μ ≈ 0 (capacitor loops: poles at
 * infinity) form a block that is zero to within ε·‖S‖; one reflection inside it turns a's part
 * into a single entry, after which k − 1 rows are zero and each only contributes μ = 0, an
 * infinite zero. The remaining problem has m − k + 1 unknowns instead of m: a mesh whose loops
 * leave half its ports without a finite pole costs an eighth of the general QR.
 *
 * Null when there is nothing to deflate (the caller solves the full zero matrix instead).
 */
export function deflatedZeroSpectrum(pm: PortModel, poles: Spectrum): Spectrum | null {
	const basis = poles.basis;
	if (!basis) return null;
	const m = pm.m;
	const { values, vectors, sqrtD } = basis;
	let max = 0;
	for (let i = 0; i < m; i++) max = Math.max(max, Math.abs(values[i]));
	const finite: number[] = [];
	const infinite: number[] = [];
	for (let i = 0; i < m; i++) (Math.abs(values[i]) > INFINITE_MU * max ? finite : infinite).push(i);
	if (infinite.length < 2) return null;
	const a = new Float64Array(m);
	const b = new Float64Array(m);
	for (let k = 0; k < m; k++) {
		let sa = 0;
		let sb = 0;
		for (let i = 0; i < m; i++) {
			const v = vectors[k * m + i] * sqrtD[i];
			sa += v * pm.h[i];
			sb += v * pm.g[i];
		}
		a[k] = sa / pm.h0;
		b[k] = sb;
	}
	// Reflection P = I − 2vvᵀ/vᵀv on the infinite block with Pᵀa = −sign(a₁)‖a‖e₁; b follows.
	let norm = 0;
	for (const i of infinite) norm += a[i] * a[i];
	norm = Math.sqrt(norm);
	let alpha = 0;
	let beta = 0;
	if (norm > 0) {
		const first = a[infinite[0]];
		alpha = first > 0 ? -norm : norm;
		const v = infinite.map((i) => a[i]);
		v[0] -= alpha;
		let vv = 0;
		let vb = 0;
		infinite.forEach((i, t) => {
			vv += v[t] * v[t];
			vb += v[t] * b[i];
		});
		beta = b[infinite[0]] - (2 * vb * v[0]) / vv;
	} else beta = b[infinite[0]]; // a vanishes on the block: every row there is already zero
	const keep = finite.length + 1;
	const ra = new Float64Array(keep);
	const rb = new Float64Array(keep);
	const diag = new Float64Array(keep);
	finite.forEach((i, t) => {
		ra[t] = a[i];
		rb[t] = b[i];
		diag[t] = values[i];
	});
	ra[keep - 1] = alpha;
	rb[keep - 1] = beta;
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
