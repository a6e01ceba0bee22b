import { computePoles, computeZeros } from './poles';
import { shiftedModel } from './shift';
import type { Doublet, PortReading, ResolvedNetwork, Singularity } from './types';

/**
 * Pole–zero doublets: a pole and a zero closer than `ratio` of the pole's magnitude. Nearly
 * cancelled in the frequency response, a doublet still leaves a slow tail in the step response —
 * the overshoot and long settling of a divider whose arms are not quite equal. For each one:
 *
 * - the tail: with H(s) = H(0)·Π(1 − s/z)/Π(1 − s/p), the step is
 *   y(t) = H(0)·[1 − Σ_i A_i·e^{p_i t}], A_i = Π_j(1 − p_i/z_j) / Π_{k≠i}(1 − p_i/p_k)
 *   (partial fractions), so the doublet pole's share of the final value is −A_i and its time
 *   constant −1/p_i. For one pole and one zero alone −A = (p − z)/z: about the separation;
 * - the element change that closes it: for the elements that move the gap most, the value at
 *   which pole and zero coincide (secant steps in log value on the exact poles and zeros).
 *
 * Real doublets only get a closing change (a complex pair needs two values to meet its zero).
 */
export const DEFAULT_DOUBLET_RATIO = 0.1;
/**
 * Doublets that get a closing change, largest tails first; each costs some twenty pole-and-zero
 * solves, so only those within the default ratio get one (the editor asks for doublets up to
 * 50 % apart and filters by its own setting).
 */
const CLOSE_AT_MOST = 2;
const CLOSE_WITHIN = DEFAULT_DOUBLET_RATIO;
const CANDIDATES = 3;
const ADJUSTABLE = new Set(['R', 'C', 'L']);
/** Each probe is a full pole and zero solve: above these sizes closing changes are not computed. */
export const CLOSING_MAX_REACTIVE = 12;
const SCAN_AT_MOST = 8;

export function findDoublets(
	net: ResolvedNetwork,
	poles: Pole[],
	zeros: Singularity[],
	dcGain: number | null,
	readings: { oc: PortReading[]; sc: PortReading[] },
	ratio = DEFAULT_DOUBLET_RATIO
): Doublet[] {
	const pairs = matchPairs(poles, zeros, ratio);
	const out = pairs.map(({ pole, zero, separation }): Doublet => {
		const p = poles[pole];
		const tail = p.im === 0 && zeros[zero].im === 0 ? tailShare(poles, zeros, pole) : null;
		return {
			pole,
			zero,
			separation,
			tail: dcGain === null || tail === null || !Number.isFinite(tail) ? null : tail,
			tailTau: p.tau,
			closing: [],
			closingNote: null
		};
	});
	// Close the largest tails first (they are what the designer trims).
	const order = out
		.map((d, i) => i)
		.filter((i) => out[i].tail !== null && Math.abs(out[i].separation) < CLOSE_WITHIN)
		.sort((i, j) => Math.abs(out[j].tail!) - Math.abs(out[i].tail!));
	if (net.reactive.length > CLOSING_MAX_REACTIVE) {
		for (const i of order)
			out[i].closingNote =
				`not computed for networks with more than ${CLOSING_MAX_REACTIVE} capacitors and inductors`;
		return out;
	}
	for (const i of order.slice(0, CLOSE_AT_MOST)) {
		const d = out[i];
		d.closing = closingChanges(net, readings, poles[d.pole], zeros[d.zero], owners(poles[d.pole]));
		if (d.closing.length === 0) d.closingNote = 'no single element value within a decade closes it';
	}
	for (const i of order.slice(CLOSE_AT_MOST))
		out[i].closingNote = `not computed (only the ${CLOSE_AT_MOST} largest tails are)`;
	for (const d of out)
		if (d.tail === null && d.closingNote === null)
			d.closingNote =
				poles[d.pole].im !== 0
					? 'a complex pair: one value cannot close it'
					: 'no finite DC gain to compare the tail with';
	return out;
}

/** Each zero to its nearest pole (relative to the pole), closest pairs first, each root used once; conjugates once. */
function matchPairs(poles: Singularity[], zeros: Singularity[], ratio: number) {
	const cand: { pole: number; zero: number; separation: number; d: number }[] = [];
	poles.forEach((p, i) => {
		if (p.im < 0) return;
		const mag = Math.hypot(p.re, p.im);
		if (!(mag > 0)) return;
		zeros.forEach((z, j) => {
			if (z.im < 0 || (p.im === 0) !== (z.im === 0)) return;
			const d = Math.hypot(z.re - p.re, z.im - p.im) / mag;
			// Real roots: (z − p)/p, negative when the zero lies below the pole (an overshooting tail).
			const separation = p.im === 0 ? (z.re - p.re) / p.re : d;
			if (d < ratio) cand.push({ pole: i, zero: j, separation, d });
		});
	});
	cand.sort((x, y) => x.d - y.d);
	const usedP = new Set<number>();
	const usedZ = new Set<number>();
	const out: { pole: number; zero: number; separation: number }[] = [];
	for (const c of cand) {
		if (usedP.has(c.pole) || usedZ.has(c.zero)) continue;
		usedP.add(c.pole);
		usedZ.add(c.zero);
		out.push({ pole: c.pole, zero: c.zero, separation: c.separation });
	}
	return out.sort((x, y) => x.pole - y.pole);
}

/** −A_i for a real pole: its exponential's share of the step's final value (partial fractions). */
export function tailShare(
	poles: { re: number; im: number }[],
	zeros: { re: number; im: number }[],
	i: number
): number | null {
	const p = poles[i];
	if (p.re === 0) return null;
	// Complex factors (1 − p/r) for a real p: multiply as complex numbers, only the real part survives in conjugate pairs.
	let re = 1;
	let im = 0;
	const mul = (r: { re: number; im: number }, inverse: boolean) => {
		const d = r.re * r.re + r.im * r.im;
		if (d === 0) return false;
		// 1 − p/r = 1 − p·conj(r)/|r|²
		let fr = 1 - (p.re * r.re) / d;
		let fi = (p.re * r.im) / d;
		if (inverse) {
			const m = fr * fr + fi * fi;
			if (m === 0) return false;
			[fr, fi] = [fr / m, -fi / m];
		}
		[re, im] = [re * fr - im * fi, re * fi + im * fr];
		return true;
	};
	for (const z of zeros) if (!mul(z, false)) return null;
	for (let k = 0; k < poles.length; k++) if (k !== i && !mul(poles[k], true)) return null;
	return Number.isFinite(re) ? -re : null;
}

/** Up to CANDIDATES element changes that make the doublet's pole and zero coincide, smallest change first. */
function closingChanges(
	net: ResolvedNetwork,
	readings: { oc: PortReading[]; sc: PortReading[] },
	p0: Singularity,
	z0: Singularity,
	poleOwners: string[]
): Doublet['closing'] {
	const gapAt = (k: number, factor: number, prev: { p: number; z: number }) => {
		const els = net.elements.map((e, j) => (j === k ? { ...e, value: e.value * factor } : e));
		return gap({ ...net, elements: els }, readings, prev);
	};
	const start = { p: p0.re, z: z0.re };
	const g0 = (z0.re - p0.re) / Math.abs(p0.re);
	// First-order effect of each adjustable element on the gap (a 1 % step). A larger network
	// scans the pole's owners and the resistors that touch them.
	const slopes: { k: number; slope: number }[] = [];
	for (const k of candidates(net, poleOwners)) {
		const g = gapAt(k, 1.01, start);
		if (g === null) continue;
		const slope = (g.g - g0) / Math.log(1.01);
		if (Math.abs(slope) > 1e-9) slopes.push({ k, slope });
	}
	// Smallest predicted change first.
	slopes.sort((x, y) => Math.abs(g0 / x.slope) - Math.abs(g0 / y.slope));
	const out: Doublet['closing'] = [];
	for (const { k, slope } of slopes.slice(0, CANDIDATES + 2)) {
		if (out.length >= CANDIDATES) break;
		const u = secant(k, slope, g0, gapAt, start);
		if (u === null) continue;
		const e = net.elements[k];
		out.push({ element: e.id, from: e.value, to: e.value * Math.exp(u), change: Math.expm1(u) });
	}
	// A trimmer is usually a capacitor: among changes within 10 % of the smallest, capacitors first.
	const least = Math.min(...out.map((c) => Math.abs(c.change)));
	const isC = (c: { element: string }) =>
		net.elements.find((e) => e.id === c.element)?.type === 'C';
	return out.sort((a, b) => {
		const near = (c: typeof a) => Math.abs(c.change) <= 1.1 * least;
		return (
			Number(near(b) && isC(b)) - Number(near(a) && isC(a)) ||
			Math.abs(a.change) - Math.abs(b.change)
		);
	});
}

type Pole = Singularity & { owners?: { element: string; share: number }[] };
const owners = (p: Pole) => (p.owners ?? []).filter((o) => o.share >= 0.01).map((o) => o.element);

/** Element indices to probe: every R, C and L of a small network, else owners and their resistors. */
function candidates(net: ResolvedNetwork, poleOwners: string[]): number[] {
	const all = net.elements.flatMap((e, k) => (ADJUSTABLE.has(e.type) ? [k] : []));
	if (all.length <= SCAN_AT_MOST) return all;
	const own = new Set(poleOwners);
	const nodes = new Set(net.elements.filter((e) => own.has(e.id)).flatMap((e) => e.nodes));
	const near = all.filter(
		(k) =>
			own.has(net.elements[k].id) ||
			(net.elements[k].type === 'R' && net.elements[k].nodes.some((n) => nodes.has(n)))
	);
	return near.slice(0, SCAN_AT_MOST);
}

/** Secant steps in u = ln(value/value0) on the gap; null unless it meets within a decade. */
function secant(
	k: number,
	slope: number,
	g0: number,
	gapAt: (
		k: number,
		factor: number,
		prev: { p: number; z: number }
	) => { g: number; p: number; z: number } | null,
	start: { p: number; z: number }
): number | null {
	let [u0, f0] = [0, g0];
	let u1 = -g0 / slope;
	let prev = start;
	for (let it = 0; it < 12; it++) {
		if (!Number.isFinite(u1) || Math.abs(u1) > Math.log(10)) return null;
		const r = gapAt(k, Math.exp(u1), prev);
		if (r === null) return null;
		if (Math.abs(r.g) < 1e-10) return u1;
		prev = { p: r.p, z: r.z };
		const next = u1 - (r.g * (u1 - u0)) / (r.g - f0);
		[u0, f0, u1] = [u1, r.g, next];
		if (Math.abs(u1 - u0) < 1e-12) return u1;
	}
	return null;
}

/** The relative gap (z − p)/|p| of the real pole and zero nearest the previous ones; null if either is gone. */
function gap(
	net: ResolvedNetwork,
	readings: { oc: PortReading[]; sc: PortReading[] },
	prev: { p: number; z: number }
) {
	try {
		const { a, pm } = shiftedModel(net, readings.oc, readings.sc);
		const poles = computePoles(a, pm).roots;
		const zeros = computeZeros(a, pm);
		if (!zeros) return null;
		const near = (list: { re: number; im: number }[], x: number) => {
			let best: number | null = null;
			for (const r of list)
				if (r.im === 0 && (best === null || Math.abs(r.re - x) < Math.abs(best - x))) best = r.re;
			return best;
		};
		const p = near(poles, prev.p);
		const z = near(zeros, prev.z);
		if (p === null || z === null || p === 0) return null;
		return { g: (z - p) / Math.abs(p), p, z };
	} catch {
		return null;
	}
}
