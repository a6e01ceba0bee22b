import { expect } from 'vitest';

import { el, net, type El } from './build';
import { ratio, solveAt, type DirectSystem } from '../../../src/lib/solver/direct-solve';

export { el, net, type El };

export const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

/** Relative-error comparison that names what is compared when it fails. */
export function expectRel(
	actual: number | null | undefined,
	expected: number,
	tol: number,
	what: string
) {
	expect(actual, `${what}: got null`).not.toBeNull();
	const e = rel(actual as number, expected);
	expect(
		e,
		`${what}: ${actual} vs ${expected} (relative error ${e.toExponential(2)} > ${tol})`
	).toBeLessThanOrEqual(tol);
}

/** Matches two lists of complex roots (any order) by nearest neighbour; returns worst relative error. */
export function worstRootError(
	got: { re: number; im: number }[],
	want: { re: number; im: number }[]
): number {
	expect(got.length, `root count ${got.length} vs ${want.length}`).toBe(want.length);
	const used = new Set<number>();
	let worst = 0;
	for (const w of want) {
		let best = -1;
		let bd = Infinity;
		got.forEach((g, i) => {
			if (used.has(i)) return;
			const d = Math.hypot(g.re - w.re, g.im - w.im);
			if (d < bd) {
				bd = d;
				best = i;
			}
		});
		used.add(best);
		worst = Math.max(worst, bd / Math.max(Math.hypot(w.re, w.im), 1e-300));
	}
	return worst;
}

/** Roots of a s² + b s + c without cancellation (real coefficients). */
export function quadratic(a: number, b: number, c: number): { re: number; im: number }[] {
	const disc = b * b - 4 * a * c;
	if (disc >= 0) {
		const q = -0.5 * (b + Math.sign(b || 1) * Math.sqrt(disc));
		return [
			{ re: q / a, im: 0 },
			{ re: c / q, im: 0 }
		];
	}
	const re = -b / (2 * a);
	const im = Math.sqrt(-disc) / (2 * a);
	return [
		{ re, im },
		{ re, im: -im }
	];
}

/** The 10:1 probe of the closed-form tests: 9 MΩ ∥ 10 pF over 1 MΩ ∥ `input` (default 90 pF), from 50 Ω. */
export const probe10x = (input: El[] = [el('Cin', 'C', ['b', 'gnd'], '90p')]) =>
	net(
		[
			el('Vin', 'V', ['src', 'gnd'], 1),
			el('Rsrc', 'R', ['src', 'a'], '50'),
			el('Rt', 'R', ['a', 'b'], '9M'),
			el('Ct', 'C', ['a', 'b'], '10p'),
			el('Rin', 'R', ['b', 'gnd'], '1M'),
			...input
		],
		'b'
	);

/**
 * Newton step H(z)/H′(z) of the network equations' direct solve, relative to |z|: near a simple
 * root of H it is the distance to it (by definition of a zero), with no eigenproblem involved.
 */
export function newtonStep(sys: DirectSystem, z: { re: number; im: number }): number {
	const p = solveAt(sys, z.re, z.im, true);
	if (!p?.dh) return Infinity;
	if (p.h.re === 0 && p.h.im === 0) return 0;
	const q = ratio(p.h, p.dh);
	return Math.hypot(q.re, q.im) / Math.hypot(z.re, z.im);
}
