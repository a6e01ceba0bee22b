import { multiplyValues, norm1 } from '../kernels/csc';
import { ldlHalfBackward, ldlHalfForward, ldlNumeric, type Ldl } from '../kernels/ldl';
import { largestEigenpairs } from '../kernels/lanczos';
import { symbolicOf, type NodalRC } from './rc-nodal';

/**
 * The k natural frequencies of a reciprocal RC network nearest a real shift σ ≥ 0 (the slowest
 * ones for σ = 0), by shift-and-invert Lanczos on the symmetric definite pencil (G, C):
 *
 *     K = G + σ·C = R·Rᵀ,   S = R⁻¹·C·R⁻ᵀ,   S·w = μ·w  ⇔  (G + s·C)·v = 0,  s = σ − 1/μ,  v = R⁻ᵀ·w.
 *
 * K is factored once, in the accurate M-matrix mode (ldl.ts), so the slowest poles of long
 * ladders keep their digits. σ = 0 when every node has a resistive path to ground or a source
 * (G is then positive definite); otherwise σ is a small positive rate (nodes reached only
 * through capacitors make G singular and put a pole at s = 0).
 *
 * Each pole comes with its mode v (node voltages, C-normalized: vᵀ·C·v = 1) and the normwise
 * backward error ‖(G + p·C)·v‖ / ((‖G‖₁ + |p|·‖C‖₁)·‖v‖) (Higham and Higham, "Structured
 * backward error and condition of generalized eigenvalue problems", SIAM J. Matrix Anal. Appl.
 * 20(2), 1998), which the analysis requires to be ≤ 1e-10.
 */
export interface RcPole {
	re: number;
	vector: Float64Array;
	backwardError: number;
}

export interface RcDominant {
	poles: RcPole[];
	shift: number;
	converged: boolean;
	applications: number;
	factor: Ldl;
}

export function rcDominantPoles(
	rc: NodalRC,
	k: number,
	shift: number | null,
	onProgress?: (converged: number) => void
): RcDominant {
	const { n, pattern, g, c } = rc;
	const sigma = shift ?? (rc.floating ? smallRate(rc) : 0);
	const values = Float64Array.from(g, (v, i) => v + sigma * c[i]);
	const excess = Float64Array.from(rc.gExcess, (v, i) => v + sigma * rc.cExcess[i]);
	const factor = ldlNumeric(symbolicOf(rc), values, excess);
	const y = new Float64Array(n);
	const z = new Float64Array(n);
	const r = largestEigenpairs(
		n,
		(w, out) => {
			ldlHalfBackward(factor, w, y);
			multiplyValues(pattern, c, y, z);
			ldlHalfForward(factor, z, out);
		},
		{ k, onRestart: onProgress }
	);
	const gNorm = norm1(pattern, g);
	const cNorm = norm1(pattern, c);
	const poles: RcPole[] = [];
	const gv = new Float64Array(n);
	const cv = new Float64Array(n);
	for (let i = 0; i < r.values.length; i++) {
		const mu = r.values[i];
		if (!(mu > 0)) continue; // μ = 0: a pole at infinity (capacitor loops, nodes without C)
		const v = ldlHalfBackward(factor, r.vectors[i], new Float64Array(n));
		// s = σ − 1/μ carries an absolute error of a few ε·σ: within that, the pole is the origin
		// (a node reached only through capacitors), as the dense path reports it.
		const raw = sigma - 1 / mu;
		const p = Math.abs(raw) <= 1e-12 * sigma ? 0 : raw;
		multiplyValues(pattern, g, v, gv);
		multiplyValues(pattern, c, v, cv);
		let res = 0;
		let vv = 0;
		let vcv = 0;
		for (let j = 0; j < n; j++) {
			const e = gv[j] + p * cv[j];
			res += e * e;
			vv += v[j] * v[j];
			vcv += v[j] * cv[j];
		}
		const scale = 1 / Math.sqrt(vcv);
		for (let j = 0; j < n; j++) v[j] *= scale;
		poles.push({
			re: p,
			vector: v,
			backwardError: Math.sqrt(res) / ((gNorm + Math.abs(p) * cNorm) * Math.sqrt(vv))
		});
	}
	return { poles, shift: sigma, converged: r.converged, applications: r.applications, factor };
}

/** A rate far below the network's own (10⁻⁶ of the mean G_ii/C_ii), for a singular G. */
function smallRate(rc: NodalRC): number {
	let gs = 0;
	let cs = 0;
	for (let j = 0; j < rc.n; j++)
		for (let p = rc.pattern.colPtr[j]; p < rc.pattern.colPtr[j + 1]; p++)
			if (rc.pattern.rowIdx[p] === j) {
				gs += rc.g[p];
				cs += rc.c[p];
			}
	return cs > 0 && gs > 0 ? (1e-6 * gs) / cs : 1;
}
