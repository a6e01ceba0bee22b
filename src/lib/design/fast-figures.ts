import type { PzForm } from '../solver/frequency-response';
import type { Modal } from '../solver/modal';
import { stepAt } from '../solver/step-response';

/**
 * Faster twins of the analysis' bandwidth and step figures, same definitions. A tolerance run
 * asks for them ten thousand times, and the analysis' versions (a 400-point scan with phase, a
 * 1500-point step grid) are built to draw plots, not to be called in a loop. Here the magnitude
 * needs no atan2 and no square root, and the grids are coarser; every crossing is still refined
 * by bisection to double precision, so the figures agree with the analysis to many digits.
 */
export function logMag2(pz: PzForm, w: number): number {
	let s = 2 * pz.logK;
	for (const z of pz.zeros) {
		const b = w - z.im;
		s += Math.log(z.re * z.re + b * b);
	}
	for (const p of pz.poles) {
		const b = w - p.im;
		s -= Math.log(p.re * p.re + b * b);
	}
	return s;
}

/** First −3 dB crossing scanning up from fMin (as the analysis defines it), in Hz. */
export function fastBandwidth(
	pz: PzForm,
	dcGain: number | null,
	range: { fMin: number; fMax: number },
	scan = 120
): number | null {
	if (dcGain === 0) return null;
	const at = (x: number) => logMag2(pz, 2 * Math.PI * Math.exp(x));
	const a = Math.log(range.fMin);
	const b = Math.log(range.fMax);
	const target = (dcGain !== null ? 2 * Math.log(Math.abs(dcGain)) : at(a)) - Math.log(2);
	let prev = a;
	for (let i = 1; i <= scan; i++) {
		const x = a + ((b - a) * i) / scan;
		if (at(x) < target) {
			let lo = prev;
			let hi = x;
			for (let k = 0; k < 80 && hi - lo > 1e-15; k++) {
				const mid = 0.5 * (lo + hi);
				if (at(mid) < target) hi = mid;
				else lo = mid;
			}
			return Math.exp(0.5 * (lo + hi));
		}
		prev = x;
	}
	return null;
}

function bisect(f: (t: number) => number, a: number, b: number): number {
	let fa = f(a);
	for (let i = 0; i < 80 && b - a > 1e-15 * b; i++) {
		const c = 0.5 * (a + b);
		const fc = f(c);
		if (fa <= 0 === fc <= 0) {
			a = c;
			fa = fc;
		} else b = c;
	}
	return 0.5 * (a + b);
}

export interface StepFigures {
	riseTime: number | null;
	overshoot: number | null;
	settlingTime: number | null;
}

/** Rise time 10–90 %, overshoot (%) and settling to 1 % of the final value. */
export function fastStepFigures(
	md: Modal,
	final: number,
	tEnd: number,
	tFast: number,
	points = 400
): StepFigures {
	const u = (x: number) => stepAt(md, x) / final;
	const grid = [0];
	const t0 = Math.min(tFast, tEnd) * 1e-3;
	for (let i = 0; i <= points; i++) grid.push(t0 * (tEnd / t0) ** (i / points));
	const vals = grid.map(u);
	const cross = (level: number) => {
		if (vals[0] >= level) return 0;
		for (let i = 1; i < grid.length; i++)
			if (vals[i] >= level) return bisect((x) => u(x) - level, grid[i - 1], grid[i]);
		return null;
	};
	const t10 = cross(0.1);
	const t90 = cross(0.9);
	let i = 0;
	for (let k = 1; k < vals.length; k++) if (vals[k] > vals[i]) i = k;
	let peak = vals[i];
	if (i > 0 && i < vals.length - 1) {
		// Golden-section search for the peak between the neighbouring samples.
		let a = grid[i - 1];
		let b = grid[i + 1];
		const r = (Math.sqrt(5) - 1) / 2;
		for (let k = 0; k < 100 && b - a > 1e-14 * b; k++) {
			const c = b - r * (b - a);
			const d = a + r * (b - a);
			if (u(c) > u(d)) b = d;
			else a = c;
		}
		peak = Math.max(peak, u(0.5 * (a + b)));
	}
	let last = -1;
	for (let k = grid.length - 1; k >= 0; k--) {
		if (Math.abs(vals[k] - 1) > 0.01) {
			last = k;
			break;
		}
	}
	let settlingTime: number | null = 0;
	if (last === grid.length - 1) settlingTime = null;
	else if (last >= 0) {
		const side = vals[last] > 1 ? 1.01 : 0.99;
		settlingTime = bisect((x) => u(x) - side, grid[last], grid[last + 1]);
	}
	return {
		riseTime: t10 !== null && t90 !== null ? t90 - t10 : null,
		overshoot: Math.max(0, (peak - 1) * 100),
		settlingTime
	};
}
