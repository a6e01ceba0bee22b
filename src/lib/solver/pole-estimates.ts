import type { EstimateMethod, PoleEstimate } from './types';

/**
 * The quick estimates of each exact pole, best first (docs/methods.md, "Estimates of each pole").
 *
 * With H(s)'s denominator 1 + b1·s + b2·s² + … (b1 = Σ τ open, b2 = Σ over pairs, …):
 * - the dominant pole ≈ −1/b1 — exact for one pole, off by Σ |p1/pk| otherwise;
 * - for well-separated poles the k-th ≈ −b(k−1)/b(k), since b(k) ≈ Π of the k slowest 1/|p|
 *   (ratios of successive coefficients; the k = 1 case is −1/b1 itself);
 * - the two slowest poles ≈ the roots of 1 + b1·s + b2·s², good when the third pole is well above
 *   the second (and the only estimate here that can be a complex pair);
 * - the k-th ≈ −1/τ of the k-th port the largest-first sequence chose.
 *
 * The headline is the simplest estimate that lands within HEADLINE_WITHIN of the exact pole;
 * when none does, the closest. Simplest means: the coefficient ratio (−1/b1 for the dominant
 * pole), then the sequential port (it names the port that sets the pole), then the two-pole
 * root. Polewise knows the exact poles, so it can say which quick reasoning holds here.
 */
export const HEADLINE_WITHIN = 0.02;
const SIMPLICITY: Record<EstimateMethod, number> = {
	b1: 0,
	ratio: 0,
	sequential: 1,
	'two-pole': 2
};

/** How many coefficient ratios are offered (b_k of high order are sums of huge numbers of terms). */
export const RATIO_ORDERS = 12;

export function poleEstimates(
	poles: { re: number; im: number }[],
	b: number[],
	sequential: { element: string; tau: number | null }[]
): PoleEstimate[][] {
	const two = twoPoleRoots(b[1], b[2]);
	return poles.map((p, rank) => {
		const mag = Math.hypot(p.re, p.im);
		const list: PoleEstimate[] = [];
		const add = (
			method: EstimateMethod,
			basis: string,
			re: number,
			im: number,
			element: string | null
		) => {
			if (!Number.isFinite(re) || !Number.isFinite(im) || !(mag > 0)) return;
			// A conjugate pair's estimate takes the sign of the pole it stands for.
			const imS = p.im < 0 ? -Math.abs(im) : Math.abs(im);
			list.push({
				method,
				basis,
				element,
				re,
				im: imS,
				hz: Math.hypot(re, im) / (2 * Math.PI),
				tau: im === 0 && re !== 0 ? -1 / re : null,
				relativeError: Math.hypot(re - p.re, imS - p.im) / mag
			});
		};
		if (rank === 0 && b[1]) add('b1', '1/b1', -1 / b[1], 0, null);
		if (rank > 0 && rank < RATIO_ORDERS && b[rank + 1] && b[rank])
			add('ratio', `b${rank}/b${rank + 1}`, -b[rank] / b[rank + 1], 0, null);
		if (two && rank < 2) {
			const r = two[rank];
			add('two-pole', '1 + b1·s + b2·s²', r.re, r.im, null);
		}
		const seq = sequential[rank];
		if (seq && seq.tau !== null && seq.tau !== 0)
			add('sequential', `port ${seq.element}`, -1 / seq.tau, 0, seq.element);
		return rankEstimates(list);
	});
}

function rankEstimates(list: PoleEstimate[]): PoleEstimate[] {
	const byError = list.slice().sort((x, y) => x.relativeError - y.relativeError);
	const close = list
		.filter((e) => e.relativeError <= HEADLINE_WITHIN)
		.sort(
			(x, y) => SIMPLICITY[x.method] - SIMPLICITY[y.method] || x.relativeError - y.relativeError
		);
	const head = close[0] ?? byError[0];
	return head ? [head, ...byError.filter((e) => e !== head)] : [];
}

/** Roots of 1 + b1·s + b2·s², slower first; null without a second-order coefficient. */
function twoPoleRoots(b1: number | undefined, b2: number | undefined) {
	if (!b1 || !b2 || !Number.isFinite(b1) || !Number.isFinite(b2)) return null;
	const disc = b1 * b1 - 4 * b2;
	if (disc >= 0) {
		// The cancellation-free pair: q = −(b1 + sign(b1)·√disc)/2, roots 1/q·… (product 1/b2).
		const q = -0.5 * (b1 + Math.sign(b1) * Math.sqrt(disc));
		const r1 = 1 / q; // = q'/… : the root of smaller magnitude for a stable pair
		const r2 = q / b2;
		const [slow, fast] = Math.abs(r1) <= Math.abs(r2) ? [r1, r2] : [r2, r1];
		return [
			{ re: slow, im: 0 },
			{ re: fast, im: 0 }
		];
	}
	const re = -b1 / (2 * b2);
	const im = Math.sqrt(-disc) / (2 * Math.abs(b2));
	return [
		{ re, im },
		{ re, im }
	];
}

/**
 * Coefficients c_0..c_kMax of Π(1 − s/r) over the roots (c_k = e_k of the −1/r; complex pairs give
 * real sums): the b_k of the denominator from the poles, the a_k/a_0 of the numerator from the
 * zeros. Roots at the origin are skipped (the caller accounts for them).
 */
export function rootPolynomial(roots: { re: number; im: number }[], kMax: number): number[] {
	const er = new Array(kMax + 1).fill(0);
	const ei = new Array(kMax + 1).fill(0);
	er[0] = 1;
	for (const p of roots) {
		const d = p.re * p.re + p.im * p.im;
		if (d === 0) continue;
		const vr = -p.re / d;
		const vi = p.im / d;
		for (let k = kMax; k >= 1; k--) {
			er[k] += vr * er[k - 1] - vi * ei[k - 1];
			ei[k] += vr * ei[k - 1] + vi * er[k - 1];
		}
	}
	return er;
}

/**
 * b_0..b_K for the estimates: b1 as the designer computes it, Σ τ open; b2 as the sum over port
 * pairs of τi·τj^i = the 2×2 principal minors of T = D·H, (tr T)² − tr(T²) halved; the higher
 * orders from the exact poles (they equal the principal-minor sums, docs/methods.md §8). Where a
 * time-constant form is not finite (an infinite reading, no DC solution) the poles give it too.
 */
export function denominatorForEstimates(
	oc: { tau: number | null }[],
	ports: { m: number; H: Float64Array; d: Float64Array; singular: boolean; infinite: Uint8Array },
	sortedPoles: { re: number; im: number }[]
): number[] {
	const b = rootPolynomial(sortedPoles, Math.min(RATIO_ORDERS + 1, sortedPoles.length));
	const finite = !ports.singular && !ports.infinite.some((x) => x);
	if (!finite) return b;
	const b1 = oc.reduce((s, t) => s + (t.tau ?? NaN), 0);
	if (Number.isFinite(b1) && b.length > 1) b[1] = b1;
	const m = ports.m;
	let tr = 0;
	let tr2 = 0;
	for (let i = 0; i < m; i++) {
		tr += ports.d[i] * ports.H[i * m + i];
		for (let j = 0; j < m; j++)
			tr2 += ports.d[i] * ports.H[i * m + j] * ports.d[j] * ports.H[j * m + i];
	}
	const b2 = (tr * tr - tr2) / 2;
	// The difference cancels when one time constant dominates; keep it only when it holds digits.
	if (Number.isFinite(b2) && b.length > 2 && Math.abs(b2) > 1e-8 * tr * tr) b[2] = b2;
	return b;
}
