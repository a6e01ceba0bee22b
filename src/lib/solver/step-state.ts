import { expm } from './kernels/expm';
import type { StateModel } from './state-model';
import { figuresOnGrid, type StepFigures } from './step-response';

/**
 * The unit-step response of a state model by the matrix exponential (kernels/expm.ts), for
 * networks whose poles may be repeated, nearly repeated or lightly damped — where a sum over
 * modes with eigenvector residues cancels catastrophically.
 *
 * With Z = [[A, B], [0, 0]], exp(Z·t) = [[e^{At}, ∫₀ᵗ e^{Aτ}dτ·B], [0, 1]] (Van Loan, "Computing
 * integrals involving the matrix exponential", IEEE Trans. Autom. Control 23(3), 1978), so the
 * state after a unit step from rest is the last column, and y(t) = D + C·x(t).
 *
 * Every time used is a multiple of a quantum q = tEnd·2⁻⁵², and E_j = exp(Z·q·2^j) for
 * j = 0…52 each come from their own expm (squaring E_0 fifty times would multiply its rounding
 * by 2⁵²; each expm scales only as far as its own norm needs). y at any t applies the E_j of the
 * bits of t/q to the state (≤ 53 matrix–vector products, errors adding, not multiplying);
 * stepping along a grid whose steps are q·2^j costs one product per step.
 */
const BITS = 52;
/** Most grid steps (a Q of 1000 rings for about 1500 periods: 24 steps a period fit). */
const MAX_STEPS = 60_000;

export interface StateStepper {
	at: (t: number) => number;
	/** y on a uniform grid of `points` over [0, tEnd]. */
	curve: (points: number) => { t: number[]; y: number[] };
	figures: (
		final: number,
		tFast: number,
		ringing: { re: number; im: number }[]
	) => StepFigures | null;
	/** Relative difference between stepping by the cached powers and one direct expm at tEnd. */
	selfCheck: () => number;
}

export function stateStepper(sm: StateModel, tEnd: number): StateStepper | null {
	const n = sm.r + 1;
	const Z = new Float64Array(n * n);
	for (let i = 0; i < sm.r; i++) {
		for (let j = 0; j < sm.r; j++) Z[i * n + j] = sm.A[i * sm.r + j];
		Z[i * n + sm.r] = sm.B[i];
	}
	const q = tEnd * 2 ** -BITS;
	const E: Float64Array[] = [];
	for (let j = 0; j <= BITS; j++) {
		const e = expm(
			Z.map((x) => x * q * 2 ** j),
			n
		);
		if (!e) return null;
		E.push(e);
	}
	const apply = (m: Float64Array, v: Float64Array) => {
		const out = new Float64Array(n);
		for (let i = 0; i < n; i++) {
			let s = 0;
			for (let j = 0; j < n; j++) s += m[i * n + j] * v[j];
			out[i] = s;
		}
		return out;
	};
	const start = () => {
		const v = new Float64Array(n);
		v[sm.r] = 1;
		return v;
	};
	const output = (v: Float64Array) => {
		let y = sm.D;
		for (let i = 0; i < sm.r; i++) y += sm.C[i] * v[i];
		return y;
	};
	const at = (t: number) => {
		let k = Math.round(t / q);
		let v = start();
		for (let j = 0; j <= BITS && k > 0; j++) {
			if (k % 2 === 1) v = apply(E[j], v);
			k = Math.floor(k / 2);
		}
		return output(v);
	};
	return {
		at,
		curve(points) {
			const m = Math.max(2, Math.floor(points));
			const t = Array.from({ length: m }, (_, i) => (tEnd * i) / (m - 1));
			const step = expm(
				Z.map((x) => (x * tEnd) / (m - 1)),
				n
			);
			if (!step) return { t, y: t.map(at) };
			let v = start();
			const y = [output(v)];
			for (let i = 1; i < m; i++) {
				v = apply(step, v);
				y.push(output(v));
			}
			return { t, y };
		},
		figures(final, tFast, ringing) {
			// Steps: from a thousandth of the fastest time constant, doubling every 24 steps (about
			// 80 samples a decade), but at most 1/24 of the shortest ringing period while any
			// ringing mode has not decayed ten time constants.
			const t0 = Math.min(tFast, tEnd) * 1e-3;
			let jStep = Math.max(0, Math.floor(Math.log2(t0 / 24 / q)));
			let ringJ = BITS;
			let ringUntil = 0;
			for (const p of ringing) {
				if (p.im <= 0) continue;
				const period = (2 * Math.PI) / p.im;
				ringJ = Math.min(ringJ, Math.max(0, Math.floor(Math.log2(period / 24 / q))));
				ringUntil = Math.max(ringUntil, p.re < 0 ? Math.min(tEnd, 10 / -p.re) : tEnd);
			}
			const grid: number[] = [0];
			const vals: number[] = [output(start()) / final];
			let v = start();
			let k = 0;
			let count = 0;
			while (k * q < tEnd) {
				if (++count > MAX_STEPS) return null;
				const t = k * q;
				let j = jStep;
				if (t < ringUntil) j = Math.min(j, ringJ);
				v = apply(E[j], v);
				k += 2 ** j;
				grid.push(k * q);
				vals.push(output(v) / final);
				// Double the step once 24 steps of it fit in the time already covered.
				if (2 ** jStep * 24 * 2 <= k) jStep = Math.min(BITS, jStep + 1);
			}
			return figuresOnGrid(Float64Array.from(grid), vals, (t) => at(t) / final);
		},
		selfCheck() {
			// A time whose binary expansion uses most of the E_j, against one expm there.
			const t = tEnd * Math.SQRT1_2;
			const direct = expm(
				Z.map((x) => x * t),
				n
			);
			if (!direct) return Infinity;
			const a = output(apply(direct, start()));
			const b = at(t);
			return Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(sm.D), 1e-300);
		}
	};
}
