import {
	logAbs,
	ratio,
	solveAt,
	toComplex,
	type DirectPoint,
	type DirectSystem
} from './direct-solve';

/**
 * Responses from the network equations (direct-solve.ts): the frequency response with its
 * group delay, the input impedance, the −3 dB bandwidth and the behaviour at infinite
 * frequency. The pole–zero form is not consulted; agreement.ts compares the two.
 */
export interface Sweep {
	f: number[];
	/** 1 where the solve succeeded (G + jωC regular), else 0 (a pole on the jω axis). */
	ok: Uint8Array;
	/** ln|H|; −Infinity where H is exactly 0. */
	logMag: Float64Array;
	/** arg H in radians, in (−π, π]. */
	arg: Float64Array;
	/** H′/H (per rad/s), from the derivative solve; NaN where H = 0 or not asked for. */
	qRe: Float64Array;
	qIm: Float64Array;
	/** Input impedance (null where infinite or undefined). */
	zin: ({ re: number; im: number } | null)[];
}

/** A sweep over `f` with nothing solved yet (every point failed until filled in). */
export function emptySweep(f: number[]): Sweep {
	const n = f.length;
	return {
		f,
		ok: new Uint8Array(n),
		logMag: new Float64Array(n).fill(-Infinity),
		arg: new Float64Array(n),
		qRe: new Float64Array(n).fill(NaN),
		qIm: new Float64Array(n).fill(NaN),
		zin: []
	};
}

/** One solve (and derivative solve) per frequency, kept as plain numbers. */
export function sweep(sys: DirectSystem, f: number[], derivative: boolean, vInput: boolean): Sweep {
	const n = f.length;
	const out = emptySweep(f);
	for (let i = 0; i < n; i++) {
		const p = solveAt(sys, 0, 2 * Math.PI * f[i], derivative);
		out.zin.push(impedance(p, vInput));
		if (!p) continue;
		out.ok[i] = 1;
		if (p.h.re === 0 && p.h.im === 0) continue;
		out.logMag[i] = logAbs(p.h);
		out.arg[i] = Math.atan2(p.h.im, p.h.re);
		if (p.dh) {
			const q = ratio(p.dh, p.h);
			out.qRe[i] = q.re;
			out.qIm[i] = q.im;
		}
	}
	return out;
}

const finiteOrNull = (x: number) => (Number.isFinite(x) ? x : null);

/** 20·log10|H| per point; null where H is exactly 0 or the network is singular (a pole on jω). */
export function magnitudeDb(s: Sweep): (number | null)[] {
	return Array.from(s.logMag, (v, i) => (s.ok[i] ? finiteOrNull((20 * v) / Math.LN10) : null));
}

/** τg = −Re(H′/H), with H′ = dH/ds from the derivative solve. */
export function groupDelay(s: Sweep): (number | null)[] {
	return Array.from(s.qRe, (q, i) => (s.ok[i] ? finiteOrNull(-q) : null));
}

/** arg H (radians) and the group delay (s) at one frequency; null where the solve fails or H = 0. */
export type PhaseProbe = (f: number) => { arg: number; delay: number } | null;

/** A probe by one more solve (and derivative solve) of the network equations. */
export function phaseProbe(sys: DirectSystem): PhaseProbe {
	return (f) => {
		const p = solveAt(sys, 0, 2 * Math.PI * f, true);
		if (!p || !p.dh || (p.h.re === 0 && p.h.im === 0)) return null;
		const q = ratio(p.dh, p.h);
		return Number.isFinite(q.re) ? { arg: Math.atan2(p.h.im, p.h.re), delay: -q.re } : null;
	};
}

/** Where the phase turns fast: a pole or zero at |Im| (Hz) with relative width |Re|/|Im|. */
export interface Resonance {
	f: number;
	width: number;
	kind: 'pole' | 'zero';
}

export function resonancesOf(
	poles: { re: number; im: number }[],
	zeros: { re: number; im: number }[] = []
): Resonance[] {
	const out: Resonance[] = [];
	for (const [kind, list] of [
		['pole', poles],
		['zero', zeros]
	] as const)
		for (const r of list)
			if (r.im > 0 && Number.isFinite(r.im))
				out.push({ f: r.im / (2 * Math.PI), width: Math.abs(r.re) / r.im, kind });
	return out;
}

/** A pole or zero this close to the jω axis (|Re|/|Im|) is on it: a lossless notch or peak. */
const ON_AXIS = 1e-9;

/** Extra solves one phase may spend on following the phase between grid points. */
const PROBE_BUDGET = 4000;
/** Intervals narrower than this (relative) are not split further. */
const MIN_SPLIT = 1e-9;

/**
 * Phase in degrees, unwrapped: from one point to the next the phase moves by −∫τg dω, and the
 * 360° branch nearest that prediction is taken. Two predictions are made from the group delay
 * at the ends — the trapezoid in ω (exact for a constant delay) and in ln ω (exact for a
 * phase linear in ln ω) — and the branch is trusted only where they agree within 45°, the step
 * is under 45°, and no pole or zero narrower than the step lies inside it (a resonance between
 * two samples turns the phase by up to 180° while the delay at both ends stays small). Elsewhere
 * the interval is split at its geometric middle with one more solve (`probe`), recursively;
 * the extra points only carry the phase and are not returned. Without a probe, or once its
 * budget is spent, the phase from there on cannot be trusted: null, and `unresolvedAt` says
 * where (Hz). The first point is put on the branch of its low-frequency asymptote k·90°
 * (k from ω·d(ln H)/dω: zeros minus poles at s = 0).
 */
export function phaseDeg(
	s: Sweep,
	delay: (number | null)[],
	follow: {
		probe?: PhaseProbe;
		resonances?: Resonance[];
		/** Extra solves allowed (default PROBE_BUDGET). */
		budget?: number;
		/** True once the time allowed for extra solves is spent. */
		expired?: () => boolean;
	} = {}
): { phaseDeg: (number | null)[]; unresolvedAt: number | null } {
	const out: (number | null)[] = [];
	const resonances = follow.resonances ?? [];
	let budget = follow.probe ? (follow.budget ?? PROBE_BUDGET) : 0;
	let unresolvedAt: number | null = null;
	let prev: { f: number; phase: number; delay: number | null } | null = null;

	// The unwrapped phase at b, given the unwrapped phase at a (radians), splitting as needed.
	const carry = (
		fa: number,
		pa: number,
		da: number | null,
		fb: number,
		rawB: number,
		db: number | null
	): number | null => {
		const wa = 2 * Math.PI * fa;
		const wb = 2 * Math.PI * fb;
		const known = da !== null && db !== null;
		const lin = known ? -((da + db) / 2) * (wb - wa) : 0;
		const log = known ? -((wa * da + wb * db) / 2) * Math.log(wb / wa) : 0;
		const inside = resonances.filter((r) => r.f > fa && r.f < fb);
		// A pair on the jω axis makes H pass through 0 (a zero) or ∞ (a pole): the phase jumps
		// there by 180°, up for a zero and down for a pole — the limit of the same part with the
		// smallest loss (its root just left of the axis). The delays at the ends do not see it.
		const jump = inside.reduce(
			(sum, r) => (r.width < ON_AXIS ? sum + (r.kind === 'zero' ? Math.PI : -Math.PI) : sum),
			0
		);
		const narrow = inside.some((r) => r.width >= ON_AXIS && r.width < Math.log(fb / fa));
		const sure =
			known && !narrow && Math.abs(lin - log) < Math.PI / 4 && Math.abs(lin) < Math.PI / 4;
		if (!sure && fb / fa - 1 > MIN_SPLIT) {
			if (budget <= 0 || !follow.probe || follow.expired?.()) return null;
			budget--;
			const fm = Math.sqrt(fa * fb);
			const m = follow.probe(fm);
			if (m) {
				const pm = carry(fa, pa, da, fm, m.arg, m.delay);
				return pm === null ? null : carry(fm, pm, m.delay, fb, rawB, db);
			}
		}
		const target = pa + (lin + log) / 2 + jump;
		return rawB + 2 * Math.PI * Math.round((target - rawB) / (2 * Math.PI));
	};

	for (let i = 0; i < s.f.length; i++) {
		if (!s.ok[i] || s.logMag[i] === -Infinity || unresolvedAt !== null) {
			out.push(null);
			continue;
		}
		const raw = s.arg[i];
		let v: number | null;
		if (prev === null) {
			// s·H′/H at s = jω: its real part counts zeros minus poles at the origin.
			const k = Number.isFinite(s.qIm[i]) ? Math.round(-2 * Math.PI * s.f[i] * s.qIm[i]) : 0;
			const target = (k * Math.PI) / 2;
			v = raw + 2 * Math.PI * Math.round((target - raw) / (2 * Math.PI));
		} else v = carry(prev.f, prev.phase, prev.delay, s.f[i], raw, delay[i]);
		if (v === null) {
			unresolvedAt = prev!.f;
			out.push(null);
			continue;
		}
		out.push((v * 180) / Math.PI);
		prev = { f: s.f[i], phase: v, delay: delay[i] };
	}
	return { phaseDeg: out, unresolvedAt };
}

/** Impedance seen by the input source from the input functional's reading (V input: 1/I). */
export function impedance(
	p: DirectPoint | null,
	vInput: boolean
): { re: number; im: number } | null {
	if (!p) return null;
	if (vInput && p.zin.re === 0 && p.zin.im === 0) return null;
	const z = vInput ? ratio({ re: 1, im: 0, ex: 0 }, p.zin) : toComplex(p.zin);
	return Number.isFinite(z.re) && Number.isFinite(z.im) ? z : null;
}

/**
 * Behaviour as s → ∞ from two direct solves far above every singularity (at S = 1e6 and 1e7
 * times `top`, on the positive real axis where a stable network has no pole): the relative
 * degree r = −lim s·H′/H (an integer; the two points must agree), and H(∞) — exactly 0 when
 * r ≥ 1, H(S) + S·H′(S) (error O((top/S)²)) when r = 0, null when H grows (r < 0). When the
 * two readings disagree (a zero far above the poles), S moves 1000× further out, five times at
 * most; null degree when they never agree or a solve fails.
 */
export function atInfinity(
	sys: DirectSystem,
	top: number
): { degree: number | null; value: number | null } {
	const reading = (S: number) => {
		const p = solveAt(sys, S, 0, true);
		if (!p?.dh) return null;
		if (p.h.re === 0 && p.h.im === 0) return { r: Infinity, p, S };
		const q = ratio(p.dh, p.h);
		return { r: -S * q.re, p, S };
	};
	const scale = top > 0 && Number.isFinite(top) ? top : 1;
	// Zeros can lie far above the poles (a bridging capacitor's zero decades up): while the two
	// readings are not the same integer, move a thousand times further out (at most five times).
	for (let k = 0; k < 6; k++) {
		const S = scale * 1e6 * 1000 ** k;
		const a = reading(S);
		const b = reading(S * 10);
		if (!a || !b) return { degree: null, value: null };
		if (a.r === Infinity && b.r === Infinity) return { degree: null, value: 0 };
		const ra = Math.round(a.r);
		if (Math.abs(a.r - ra) > 1e-3 || Math.abs(b.r - ra) > 1e-3) continue;
		if (ra >= 1) return { degree: ra, value: 0 };
		if (ra < 0) return { degree: ra, value: null };
		const h = toComplex(b.p.h);
		const dh = toComplex(b.p.dh!);
		return { degree: 0, value: finiteOrNull(h.re + b.S * dh.re) };
	}
	return { degree: null, value: null };
}

/**
 * The −3 dB frequency from the direct solve: the first grid point whose |H| is below |DC gain|/√2,
 * then the crossing refined by the Illinois variant of regula falsi on ln|H| against ln f
 * (superlinear, bracketed: at most 60 solves, stopping at 1e-13 in ln f).
 */
export function bandwidthDirect(sys: DirectSystem, dcGain: number | null, s: Sweep): number | null {
	if (dcGain === 0 || dcGain === null || !Number.isFinite(dcGain)) return null;
	const target = Math.log(Math.abs(dcGain)) - 0.5 * Math.log(2);
	const g = (lf: number) => {
		const p = solveAt(sys, 0, 2 * Math.PI * Math.exp(lf));
		return p ? logAbs(p.h) - target : NaN;
	};
	// ln|H| − target and its slope d/d(ln f) = Re(s·H′/H) at each grid point.
	const val = Array.from(s.logMag, (v, i) => (s.ok[i] ? v - target : NaN));
	const slope = Array.from(s.qIm, (q, i) => -2 * Math.PI * s.f[i] * q);
	const delay = (i: number) => (Number.isFinite(s.qRe[i]) ? s.qRe[i] : 0);
	let prev = -1;
	for (let i = 0; i < s.f.length; i++) {
		if (!Number.isFinite(val[i])) continue;
		if (prev >= 0) {
			const a = Math.log(s.f[prev]);
			const b = Math.log(s.f[i]);
			// A resonant structure (a lumped line near its cut-off) can dip below the level and
			// come back between two grid points. Sample the interval closer when the phase turns
			// by more than 45° across it (from the group delay) or when the cubic through the
			// values and slopes dips below the level.
			const turn = Math.abs(((delay(prev) + delay(i)) / 2) * 2 * Math.PI * (s.f[i] - s.f[prev]));
			const dip =
				val[i] >= 0 && hermiteMin(val[prev], val[i], slope[prev] * (b - a), slope[i] * (b - a)) < 0;
			const parts = Math.min(512, Math.max(dip ? 16 : 1, Math.ceil(turn / (Math.PI / 4))));
			let x0 = a;
			let v0 = val[prev];
			for (let k = 1; k <= parts; k++) {
				const x1 = a + ((b - a) * k) / parts;
				const v1 = k === parts ? val[i] : g(x1);
				if (v1 < 0) return refine(g, x0, x1, v0, v1);
				x0 = x1;
				v0 = v1;
			}
		} else if (val[i] < 0) return null; // already below at the bottom of the range
		prev = i;
	}
	return null;
}

/** Smallest value on [0, 1] of the cubic Hermite interpolant with end values and slopes. */
function hermiteMin(v0: number, v1: number, d0: number, d1: number): number {
	if (!Number.isFinite(d0) || !Number.isFinite(d1)) return Math.min(v0, v1);
	let min = Math.min(v0, v1);
	for (let k = 1; k < 32; k++) {
		const t = k / 32;
		const h00 = (1 + 2 * t) * (1 - t) * (1 - t);
		const h10 = t * (1 - t) * (1 - t);
		const h01 = t * t * (3 - 2 * t);
		const h11 = t * t * (t - 1);
		min = Math.min(min, h00 * v0 + h10 * d0 + h01 * v1 + h11 * d1);
	}
	return min;
}

/** Illinois regula falsi on a bracket [a, b] with g(a) > 0 > g(b), in ln f. */
function refine(
	g: (x: number) => number,
	a: number,
	b: number,
	fa: number,
	fb: number
): number | null {
	let side = 0;
	for (let k = 0; k < 60 && b - a > 1e-13; k++) {
		let c = b - (fb * (b - a)) / (fb - fa);
		if (!(c > a && c < b)) c = 0.5 * (a + b);
		const fc = g(c);
		if (!Number.isFinite(fc)) return null;
		if (fc === 0) return Math.exp(c);
		if (fc < 0) {
			b = c;
			fb = fc;
			if (side === -1) fa /= 2;
			side = -1;
		} else {
			a = c;
			fa = fc;
			if (side === 1) fb /= 2;
			side = 1;
		}
	}
	return Math.exp(0.5 * (a + b));
}
