/**
 * The generic dense route a numerical user would take in this runtime with the project's own
 * matrix library (ml-matrix), measured beside the full analysis of the 300-capacitor mesh
 * (issue 15's target: our full analysis within 2× of it, in the same run):
 *
 *   - modified nodal G and C of the network (R, C, L, V), assembled densely;
 *   - every natural frequency from the eigenvalues μ of G⁻¹·C (one LU of G, the nonsymmetric
 *     eigenvalue decomposition of ml-matrix), s = −1/μ for μ ≠ 0 (a shift-invert form of the
 *     pencil G + sC, since ml-matrix has no QZ and C is singular);
 *   - every open-circuit time constant C_k·(p_kᵀ·G⁻¹·p_k), one solve with the same LU per
 *     capacitor (p_k the capacitor's node incidence).
 *
 * It computes the poles and the open-circuit τ only — no zeros, responses, step, other τ views.
 * Independent of src/lib/solver on purpose: it is the yardstick, not a second engine.
 */
import { EigenvalueDecomposition, LuDecomposition, Matrix } from 'ml-matrix';
import type { DenseDoc } from './dense-networks';

export function genericDenseRoute(doc: DenseDoc): {
	poles: { re: number; im: number }[];
	tau: number[];
} {
	const nodes = new Map<string, number>();
	for (const e of doc.elements)
		for (const nd of e.nodes.slice(0, 2))
			if (nd !== 'gnd' && !nodes.has(nd)) nodes.set(nd, nodes.size);
	let size = nodes.size;
	const branch = new Map<string, number>();
	for (const e of doc.elements) if (e.type === 'V' || e.type === 'L') branch.set(e.id, size++);
	const G = Matrix.zeros(size, size);
	const C = Matrix.zeros(size, size);
	const add = (m: Matrix, i: number, j: number, v: number) => {
		if (i >= 0 && j >= 0) m.set(i, j, m.get(i, j) + v);
	};
	const at = (e: DenseDoc['elements'][number]) =>
		e.nodes.slice(0, 2).map((x) => nodes.get(x) ?? -1);
	for (const e of doc.elements) {
		const [a, b] = at(e);
		if (e.type === 'R' || e.type === 'C') {
			const m = e.type === 'R' ? G : C;
			const y = e.type === 'R' ? 1 / e.value : e.value;
			add(m, a, a, y);
			add(m, b, b, y);
			add(m, a, b, -y);
			add(m, b, a, -y);
		} else if (e.type === 'V' || e.type === 'L') {
			const k = branch.get(e.id)!;
			add(G, a, k, 1);
			add(G, b, k, -1);
			add(G, k, a, 1);
			add(G, k, b, -1);
			if (e.type === 'L') add(C, k, k, -e.value);
		} else throw new Error(`generic route: element type ${e.type} not handled`);
	}
	const lu = new LuDecomposition(G);
	const eig = new EigenvalueDecomposition(lu.solve(C), { assumeSymmetric: false });
	const poles: { re: number; im: number }[] = [];
	const re = eig.realEigenvalues;
	const im = eig.imaginaryEigenvalues;
	const top = Math.max(...re.map((r, i) => Math.hypot(r, im[i])));
	for (let i = 0; i < re.length; i++) {
		const d = re[i] * re[i] + im[i] * im[i];
		if (Math.sqrt(d) > 1e-12 * top) poles.push({ re: -re[i] / d, im: im[i] / d });
	}
	const tau: number[] = [];
	for (const e of doc.elements) {
		if (e.type !== 'C') continue;
		const [a, b] = at(e);
		const p = Matrix.zeros(size, 1);
		if (a >= 0) p.set(a, 0, 1);
		if (b >= 0) p.set(b, 0, -1);
		const x = lu.solve(p);
		let r = 0;
		for (let i = 0; i < size; i++) r += p.get(i, 0) * x.get(i, 0);
		tau.push(e.value * r);
	}
	return { poles, tau };
}
