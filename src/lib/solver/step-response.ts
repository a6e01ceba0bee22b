import type { Modal } from './modal';

/**
 * Step response from the pole–residue form: for a unit step, Y(s) = H(s)/s, so
 *   y(t) = D∞ + Σ r_i (e^{p_i t} − 1) / p_i     (r_i·t for a pole at the origin).
 * Exact at any t with no time stepping, which matters here: a probe's poles 10⁵ apart would need
 * 10⁵ steps per slow time constant to step through. (It assumes distinct poles; a defective
 * pair shows up as huge opposite residues, which the analysis checks and warns about.)
 *
 * stepEvaluator prepares that sum once for many t: the residues divided by their poles ahead of
 * time, real poles (all of them in an RC network) on a one-expm1 path, sorted fastest first.
 *
 * Below −40, expm1 is exactly −1 in double precision (its own cut-off is −56·ln 2) and below −746
 * exp is exactly 0. With the real rates sorted, the modes that have fully decayed at time t are a
 * prefix of the list, so their constant −Σ gain comes from a prefix sum and only the live modes
 * call expm1: at late times, where most of a metrics grid lies, that is a handful of the poles.
 */
export function stepEvaluator(md: Modal): (t: number) => number {
	let origin = 0;
	const real: { rate: number; gain: number }[] = [];
	const cp: number[] = [];
	for (const p of md.poles) {
		if (p.re === 0 && p.im === 0) origin += p.rr;
		else if (p.im === 0) real.push({ rate: p.re, gain: p.rr / p.re });
		else {
			// q = r / p, so the term is Re(q·(e^{pt} − 1)).
			const d = p.re * p.re + p.im * p.im;
			cp.push(p.re, p.im, (p.rr * p.re + p.ri * p.im) / d, (p.ri * p.re - p.rr * p.im) / d);
		}
	}
	real.sort((a, b) => a.rate - b.rate);
	const nr = real.length;
	const realRate = Float64Array.from(real, (x) => x.rate);
	const realGain = Float64Array.from(real, (x) => x.gain);
	// decayed[c] = Σ_{i<c} gain_i: the settled contribution (−1 each) of the c fastest modes.
	const decayed = new Float64Array(nr + 1);
	for (let i = 0; i < nr; i++) decayed[i + 1] = decayed[i] + realGain[i];
	const cx = Float64Array.from(cp);
	const direct = md.direct;
	/** Count of leading modes with rate·t < −40 (all rates sorted ascending, t ≥ 0). */
	const settledCount = (t: number) => {
		if (!(t > 0) || nr === 0 || realRate[0] * t >= -40) return 0;
		let lo = 1;
		let hi = nr;
		while (lo < hi) {
			const mid = (lo + hi) >> 1;
			if (realRate[mid] * t < -40) lo = mid + 1;
			else hi = mid;
		}
		return lo;
	};
	return (t: number) => {
		const c = settledCount(t);
		let y = direct + origin * t - decayed[c];
		for (let i = c; i < nr; i++) y += realGain[i] * Math.expm1(realRate[i] * t);
		for (let i = 0; i < cx.length; i += 4) {
			const x = cx[i] * t;
			if (x < -746) {
				y -= cx[i + 2];
				continue;
			}
			const er = Math.exp(x);
			const w = cx[i + 1] * t;
			y += cx[i + 2] * (er * Math.cos(w) - 1) - cx[i + 3] * er * Math.sin(w);
		}
		return y;
	};
}

/** Log samples per decade: a sum of real exponentials changes shape over about a decade of t. */
const PER_DECADE = 60;
/** Linear samples per period of a ringing mode. */
const PER_PERIOD = 24;
/** Most ringing samples × poles to evaluate (a Q of 250 needs ~19 000 samples of 2 poles). */
const RINGING_WORK = 2e5;

/**
 * Sample times for locating the crossings, the peak and the last exit from the 1 % band: log
 * spaced from t0 to tEnd (fast and slow real poles both resolved), plus, for each complex pair,
 * PER_PERIOD samples per period until it has decayed ten time constants (or to tEnd) — on a log
 * grid alone a Q of 10 or more would ring between samples and its last excursion be missed.
 */
export function metricsGrid(md: Modal, tEnd: number, t0: number): Float64Array {
	const decades = Math.log10(tEnd / t0);
	const nLog = Math.min(1500, Math.max(200, Math.ceil(PER_DECADE * decades)));
	const ts: number[] = [0];
	for (let i = 0; i <= nLog; i++) ts.push(t0 * (tEnd / t0) ** (i / nLog));
	const ringing = md.poles.filter((p) => p.im > 0);
	const budget = Math.min(50_000, Math.max(6000, RINGING_WORK / md.poles.length));
	const share = Math.floor(budget / Math.max(1, ringing.length));
	for (const p of ringing) {
		const stop = p.re < 0 ? Math.min(tEnd, 10 / -p.re) : tEnd;
		const count = Math.min(share, Math.ceil((stop * p.im * PER_PERIOD) / (2 * Math.PI)));
		for (let k = 1; k <= count; k++) ts.push((stop * k) / count);
	}
	const grid = Float64Array.from(ts).sort();
	let w = 1;
	for (let i = 1; i < grid.length; i++) if (grid[i] > grid[w - 1]) grid[w++] = grid[i];
	return grid.subarray(0, w);
}

export interface StepResult {
	t: number[];
	y: number[];
	riseTime: number | null;
	overshoot: number | null;
	settlingTime: number | null;
	final: number | null;
}

/** Finds the t in [a, b] where f changes sign; 80 bisections reach double precision. */
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

/** Golden-section search for the maximum of f on [a, b] (f unimodal there). */
function refineExtremum(
	f: (t: number) => number,
	a: number,
	b: number
): { t: number; value: number } {
	const r = (Math.sqrt(5) - 1) / 2;
	let c = b - r * (b - a);
	let d = a + r * (b - a);
	let fc = f(c);
	let fd = f(d);
	for (let k = 0; k < 100 && b - a > 1e-14 * b; k++) {
		if (fc > fd) {
			b = d;
			d = c;
			fd = fc;
			c = b - r * (b - a);
			fc = f(c);
		} else {
			a = c;
			c = d;
			fc = fd;
			d = a + r * (b - a);
			fd = f(d);
		}
	}
	return fc > fd ? { t: c, value: fc } : { t: d, value: fd };
}

/** Golden-section search around the largest sample: the peak between grid points. */
function refinePeak(u: (t: number) => number, grid: Float64Array, vals: number[]): number {
	let i = 0;
	for (let k = 1; k < vals.length; k++) if (vals[k] > vals[i]) i = k;
	if (i === 0 || i === vals.length - 1) return vals[i];
	return Math.max(vals[i], refineExtremum(u, grid[i - 1], grid[i + 1]).value);
}

export interface StepFigures {
	riseTime: number | null;
	overshoot: number | null;
	settlingTime: number | null;
}

/**
 * Rise time 10–90 %, overshoot (%) and the last exit from the ±1 % band of the final value, from
 * the pole–residue form: located on metricsGrid, refined by bisection (crossings) and golden
 * section (peak) to double precision. The analysis and the design aids share this one definition.
 */
export function stepMetrics(
	md: Modal,
	final: number,
	tEnd: number,
	tFast: number,
	at: (t: number) => number = stepEvaluator(md)
): StepFigures {
	const grid = metricsGrid(md, tEnd, Math.min(tFast, tEnd) * 1e-3);
	const u = (x: number) => at(x) / final;
	return figuresOnGrid(grid, Array.from(grid, u), u);
}

/**
 * The three figures from samples `vals` = y/final on an increasing `grid` (fine enough that no
 * crossing hides between samples), refined with the exact normalized response `u`.
 */
export function figuresOnGrid(
	grid: Float64Array,
	vals: number[],
	u: (t: number) => number
): StepFigures {
	const cross = (level: number) => {
		if (vals[0] >= level) return 0;
		for (let i = 1; i < grid.length; i++) {
			if (vals[i] >= level) return bisect((x) => u(x) - level, grid[i - 1], grid[i]);
		}
		return null;
	};
	const t10 = cross(0.1);
	const t90 = cross(0.9);
	const peak = refinePeak(u, grid, vals);
	let last = -1;
	for (let i = grid.length - 1; i >= 0; i--) {
		if (Math.abs(vals[i] - 1) > 0.01) {
			last = i;
			break;
		}
	}
	let settlingTime: number | null = 0;
	if (last === grid.length - 1) settlingTime = null;
	else {
		// A ringing excursion that leaves the band by less than the sampling can see (24 samples
		// a period miss up to 0.9 % of a peak) lies between samples: refine every sampled local
		// extremum after the last exit that comes within 2 % of the band edge, latest first.
		let exit: { a: number; b: number; side: number } | null =
			last >= 0 ? { a: grid[last], b: grid[last + 1], side: vals[last] > 1 ? 1.01 : 0.99 } : null;
		for (let i = grid.length - 2; i > Math.max(0, last); i--) {
			const d = Math.abs(vals[i] - 1);
			if (d < 0.0098 || d < Math.abs(vals[i - 1] - 1) || d < Math.abs(vals[i + 1] - 1)) continue;
			const up = vals[i] > 1;
			const at = refineExtremum((x) => (up ? u(x) : 2 - u(x)), grid[i - 1], grid[i + 1]);
			if (at.value - 1 > 0.01) {
				exit = { a: at.t, b: grid[i + 1], side: up ? 1.01 : 0.99 };
				break;
			}
		}
		if (exit) settlingTime = bisect((x) => u(x) - exit!.side, exit.a, exit.b);
	}
	return {
		riseTime: t10 !== null && t90 !== null ? t90 - t10 : null,
		overshoot: Math.max(0, (peak - 1) * 100),
		settlingTime
	};
}

export function stepResponse(
	md: Modal,
	final: number | null,
	tEnd: number,
	tFast: number,
	points: number
): StepResult {
	const n = Math.max(2, Math.floor(points));
	const at = stepEvaluator(md);
	const t = Array.from({ length: n }, (_, i) => (tEnd * i) / (n - 1));
	const y = t.map(at);
	if (final === null || final === 0 || !Number.isFinite(final)) {
		return { t, y, riseTime: null, overshoot: null, settlingTime: null, final };
	}
	return { t, y, ...stepMetrics(md, final, tEnd, tFast, at), final };
}
