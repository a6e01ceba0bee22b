import { ratio, solveAt, type DirectSystem } from './direct-solve';
import type { Root } from './poles';

/**
 * Confirms transmission zeros on the network equations and finds the ones the eigenproblem lost.
 *
 * A zero z of H is confirmed when the Newton step H/H′ at z (both from direct solves) is below
 * 1e-3·|z| and the iteration then settles: near a zero of order k, H/H′ ≈ (s − z)/k, while at a
 * point that is no zero it is of the order of the distance to the nearest singularity (a
 * rounded infinite zero far above the poles steps by about |z|/4). A confirmed zero is polished
 * by up to eight Newton steps. (The gate was 1e-6: a zero three decades above the shift came
 * out of the eigenproblem 2.3e-6 off and was dropped, and the count then "recovered" a wrong
 * one beside a pole; another, at −2.53e12 s⁻¹ on a mesh whose fastest pole is 3.3e10, came
 * 1.4e-4 off. A rounded infinite zero far above the poles steps by a quarter of |z| or more.) Rounding in the eigenproblem produces candidates that fail this test (a
 * right-half-plane "zero" of a ladder whose numerator is a constant); they are dropped.
 *
 * A zero lost next to a pole (a near-cancelling pair whose zero the eigenproblem merged into
 * the pole) leaves that pole with a small residue: near p, H(s) = r/(s − p) + R(s) and, for a
 * pair, r = R(p)·(p − z). From f(s) = H(s)·(s − p) at p ± η|p|, r ≈ (f₊ + f₋)/2 and
 * R(p) ≈ (f₊ − f₋)/(2η|p|), so z ≈ p − r/R(p); Newton on H finishes it.
 */
const CONFIRM = 1e-3;
const PAIR = 0.01;
/**
 * Newton must also settle: its last step below 1e-8·|z| (a double zero converges linearly,
 * halving the step, so eight steps from the gate get there). An unsettled iteration is no
 * zero: a real start beside a complex pair, kept on the real axis, stalls near the pair's real
 * part with steps of 1 % (a random RC mesh "recovered" such a zero at −2.386e8 where |H| was
 * 1.6e-3; the pair was at −2.388e8 ± 1.08e6j).
 */
const SETTLED = 1e-8;

export interface CheckedZero {
	re: number;
	im: number;
}

function newtonStep(sys: DirectSystem, re: number, im: number) {
	const p = solveAt(sys, re, im, true);
	if (!p?.dh) return null;
	if (p.h.re === 0 && p.h.im === 0) return { re: 0, im: 0 };
	if (p.dh.re === 0 && p.dh.im === 0) return null;
	const q = ratio(p.h, p.dh);
	return Number.isFinite(q.re) && Number.isFinite(q.im) ? q : null;
}

/**
 * The zero near (re, im) after Newton polishing, or null when (re, im) is no zero: the first
 * step must be below `gate`·|z|, and the iteration must settle (at most 8 steps).
 */
export function confirmZero(
	sys: DirectSystem,
	re: number,
	im: number,
	gate = CONFIRM
): CheckedZero | null {
	const r0 = Math.hypot(re, im);
	if (r0 === 0) return { re: 0, im: 0 };
	let zr = re;
	let zi = im;
	let step = newtonStep(sys, zr, zi);
	if (!step || Math.hypot(step.re, step.im) > gate * r0) return null;
	let last = Infinity;
	for (let k = 0; k < 8 && step; k++) {
		last = Math.hypot(step.re, step.im);
		zr -= step.re;
		zi = im === 0 ? 0 : zi - step.im;
		if (last <= 1e-14 * r0) break;
		step = newtonStep(sys, zr, zi);
	}
	if (!(last <= SETTLED * r0)) return null;
	return Math.hypot(zr - re, zi - im) <= 2 * gate * r0 ? { re: zr, im: zi } : null;
}

/** The zero hidden beside pole p (within 1 % of |p|), or null. */
export function zeroBesidePole(
	sys: DirectSystem,
	p: { re: number; im: number }
): CheckedZero | null {
	const mag = Math.hypot(p.re, p.im);
	if (mag === 0) return null;
	const eta = 1e-6 * mag;
	// f(s) = H(s)·(s − p) at s = p ± η; both scaled to the larger one's binary exponent (the
	// quotient r/R does not depend on the common scale).
	const hp = solveAt(sys, p.re + eta, p.im);
	const hm = solveAt(sys, p.re - eta, p.im);
	if (!hp || !hm) return null;
	const top = Math.max(hp.h.ex, hm.h.ex);
	const sp = eta * 2 ** (hp.h.ex - top);
	const sm = -eta * 2 ** (hm.h.ex - top);
	const fp = { re: hp.h.re * sp, im: hp.h.im * sp };
	const fm = { re: hm.h.re * sm, im: hm.h.im * sm };
	const r = { re: (fp.re + fm.re) / 2, im: (fp.im + fm.im) / 2 };
	const R = { re: (fp.re - fm.re) / (2 * eta), im: (fp.im - fm.im) / (2 * eta) };
	const d = R.re * R.re + R.im * R.im;
	if (!(d > 0) || !Number.isFinite(d)) return null;
	// z = p − r/R
	const qr = (r.re * R.re + r.im * R.im) / d;
	const qi = (r.im * R.re - r.re * R.im) / d;
	const gap = Math.hypot(qr, qi);
	if (!(gap < PAIR * mag)) return null;
	const z0 = { re: p.re - qr, im: p.im === 0 ? 0 : p.im - qi };
	// An exact cancellation leaves z on p, where G + sC is singular: nothing to polish there.
	if (gap < 1e-9 * mag) return z0;
	// Unconfirmed, z0 is no zero: returning it reported a "recovered" zero at the end of a plain
	// RC ladder (whose numerator is a constant) and zeros 0.1–1 % off in dense spectra.
	const z = confirmZero(sys, z0.re, z0.im, PAIR);
	return z && Math.hypot(z.re - p.re, z.im - p.im) < PAIR * mag ? z : null;
}

/**
 * The finite zeros: candidates from the eigenproblem confirmed by the direct solve, completed
 * with zeros found beside poles while fewer than `expected` (poles minus the relative degree;
 * null when unknown) are confirmed. Conjugate pairs are checked once. `lost` counts the zeros
 * that were found beside poles, `dropped` the candidates that were no zeros.
 */
export function checkedZeros(
	sys: DirectSystem,
	candidates: Root[],
	poles: Root[],
	expected: number | null,
	zerosAtOrigin: number
): { zeros: CheckedZero[]; found: number; dropped: number } {
	const out: CheckedZero[] = [];
	let dropped = 0;
	for (let i = 0; i < zerosAtOrigin; i++) out.push({ re: 0, im: 0 });
	const push = (z: CheckedZero) => {
		out.push(z);
		if (z.im !== 0) out.push({ re: z.re, im: -z.im });
	};
	const nearPole = (z: { re: number; im: number }) =>
		poles.find(
			(p) => p.im >= 0 && Math.hypot(z.re - p.re, z.im - p.im) < PAIR * Math.hypot(p.re, p.im)
		);
	for (const c of candidates) {
		if (c.im < 0 || (c.re === 0 && c.im === 0)) continue;
		// Beside a pole the solve is nearly singular at the zero: where Newton from the candidate
		// does not confirm it, the residue test decides (two more solves; in a dense spectrum
		// every candidate lies within 1 % of some pole, so Newton is tried first).
		const p = nearPole(c);
		const z = p
			? (confirmZero(sys, c.re, c.im) ?? zeroBesidePole(sys, p))
			: confirmZero(sys, c.re, c.im);
		// A candidate that walked onto a zero already in the list (the wider gate lets Newton
		// travel up to 1e-3·|z|) is that zero again, not a second one; a genuine double zero's
		// two candidates each start within about √ε of it and stay.
		const again =
			z &&
			Math.hypot(z.re - c.re, z.im - c.im) > 1e-6 * Math.hypot(z.re, z.im) &&
			out.some((w) => Math.hypot(w.re - z.re, w.im - z.im) <= 1e-10 * Math.hypot(z.re, z.im));
		if (z && !again && !(z.re === 0 && z.im === 0)) push(z);
		else if (!z || again) dropped += c.im > 0 ? 2 : 1;
	}
	let found = 0;
	if (expected === null || out.length < expected) {
		for (const p of poles) {
			if (expected !== null && out.length >= expected) break;
			if (p.im < 0) continue;
			const mag = Math.hypot(p.re, p.im);
			if (out.some((z) => Math.hypot(z.re - p.re, z.im - p.im) < PAIR * mag)) continue;
			const z = zeroBesidePole(sys, p);
			if (z) {
				push(z);
				found += z.im !== 0 ? 2 : 1;
			}
		}
	}
	return { zeros: out, found, dropped };
}
