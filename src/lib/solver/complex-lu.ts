/**
 * Dense complex LU with partial pivoting (separate re/im arrays, row-major), for direct solves
 * of G + sC at a complex frequency: pole polishing and frequencyResponseAt.
 */
export interface ComplexLU {
	n: number;
	re: Float64Array;
	im: Float64Array;
	piv: Int32Array;
	singular: boolean;
}

export function cluFactor(re0: Float64Array, im0: Float64Array, n: number): ComplexLU {
	const re = re0.slice();
	const im = im0.slice();
	const piv = new Int32Array(n);
	let singular = false;
	for (let k = 0; k < n; k++) {
		let p = k;
		let best = Math.hypot(re[k * n + k], im[k * n + k]);
		for (let i = k + 1; i < n; i++) {
			const v = Math.hypot(re[i * n + k], im[i * n + k]);
			if (v > best) {
				best = v;
				p = i;
			}
		}
		piv[k] = p;
		if (p !== k) {
			for (let j = 0; j < n; j++) {
				let t = re[k * n + j];
				re[k * n + j] = re[p * n + j];
				re[p * n + j] = t;
				t = im[k * n + j];
				im[k * n + j] = im[p * n + j];
				im[p * n + j] = t;
			}
		}
		const dr = re[k * n + k];
		const di = im[k * n + k];
		const d2 = dr * dr + di * di;
		if (d2 === 0) {
			singular = true;
			continue;
		}
		for (let i = k + 1; i < n; i++) {
			const ar = re[i * n + k];
			const ai = im[i * n + k];
			if (ar === 0 && ai === 0) continue;
			const fr = (ar * dr + ai * di) / d2;
			const fi = (ai * dr - ar * di) / d2;
			re[i * n + k] = fr;
			im[i * n + k] = fi;
			for (let j = k + 1; j < n; j++) {
				const br = re[k * n + j];
				const bi = im[k * n + j];
				re[i * n + j] -= fr * br - fi * bi;
				im[i * n + j] -= fr * bi + fi * br;
			}
		}
	}
	return { n, re, im, piv, singular };
}

/** Solves in place (br, bi become the solution). */
export function cluSolve(f: ComplexLU, br: Float64Array, bi: Float64Array): void {
	const { n, re, im, piv } = f;
	for (let k = 0; k < n; k++) {
		const p = piv[k];
		if (p !== k) {
			let t = br[k];
			br[k] = br[p];
			br[p] = t;
			t = bi[k];
			bi[k] = bi[p];
			bi[p] = t;
		}
	}
	for (let i = 1; i < n; i++) {
		let sr = br[i];
		let si = bi[i];
		for (let j = 0; j < i; j++) {
			const lr = re[i * n + j];
			const li = im[i * n + j];
			sr -= lr * br[j] - li * bi[j];
			si -= lr * bi[j] + li * br[j];
		}
		br[i] = sr;
		bi[i] = si;
	}
	for (let i = n - 1; i >= 0; i--) {
		let sr = br[i];
		let si = bi[i];
		for (let j = i + 1; j < n; j++) {
			const ur = re[i * n + j];
			const ui = im[i * n + j];
			sr -= ur * br[j] - ui * bi[j];
			si -= ur * bi[j] + ui * br[j];
		}
		const dr = re[i * n + i];
		const di = im[i * n + i];
		const d2 = dr * dr + di * di;
		br[i] = (sr * dr + si * di) / d2;
		bi[i] = (si * dr - sr * di) / d2;
	}
}
