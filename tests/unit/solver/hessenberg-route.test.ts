import { describe, expect, test } from 'vitest';
import * as math from 'mathjs';
import { analyze, validateNetwork } from '../../../src/lib/solver/index';
import { assemble } from '../../../src/lib/solver/assemble';
import {
	directSystem,
	ratio,
	routeOverride,
	solveAt,
	toComplex,
	type DirectPoint,
	type Wide
} from '../../../src/lib/solver/direct-solve';
import {
	shiftedFactor,
	shiftedFactorWorkspace,
	shiftedSolve
} from '../../../src/lib/solver/kernels/shifted-hessenberg';
import { el, net, type El } from './helpers';
import { randomNetwork, rng, type NetworkClass } from './random-networks';
import {
	bufferedRc,
	ccvsResistor,
	lcProbe,
	stiffDividerNet,
	tenDecadeLadder
} from './trust-networks';

/**
 * The Hessenberg route of the network equations (hessenberg-route.ts: one reduction of the
 * shift-inverted pencil, Laub 1981, then O(n²) per point, each answer certified by its
 * componentwise backward error) against the banded LU route it replaces for wide-band networks
 * (direct-solve.ts, LAPACK zgbtf2's elimination). Both are built from the same assembly; the
 * test forces each route. Wherever the Hessenberg route answers, H, dH/ds and the input
 * functional must equal the LU's to 1e-9 (relative); where it declines, solveAt falls back to
 * the LU, so the answer is the LU's by construction. The route must answer most points, or the
 * comparison would prove nothing.
 */

describe('the shifted Hessenberg solve (kernel) against mathjs', () => {
	test('(I + σH)·w = z for random Hessenberg H and complex σ equals mathjs lusolve (1e-12)', () => {
		const r = rng(42);
		for (let trial = 0; trial < 20; trial++) {
			const n = 2 + Math.floor(r() * 9);
			const h = new Float64Array(n * n);
			for (let i = 0; i < n; i++)
				for (let j = Math.max(0, i - 1); j < n; j++) h[i * n + j] = (r() - 0.5) * 10 ** (3 * r());
			const sr = (r() - 0.5) * 10 ** (4 * r() - 2);
			const si = (r() - 0.5) * 10 ** (4 * r() - 2);
			const zr = Float64Array.from({ length: n }, () => r() - 0.5);
			const zi = Float64Array.from({ length: n }, () => r() - 0.5);
			const A = Array.from({ length: n }, (_, i) =>
				Array.from({ length: n }, (_, j) =>
					math.complex((i === j ? 1 : 0) + sr * h[i * n + j], si * h[i * n + j])
				)
			);
			const b = Array.from({ length: n }, (_, i) => [math.complex(zr[i], zi[i])]);
			const want = (math.lusolve(A, b) as unknown as math.Complex[][]).map((row) => row[0]);
			const f = shiftedFactorWorkspace(n);
			expect(shiftedFactor(f, h, sr, si)).toBe(true);
			shiftedSolve(f, zr, zi);
			const scale = Math.max(...want.map((w) => Math.hypot(w.re, w.im)));
			for (let i = 0; i < n; i++)
				expect(Math.hypot(zr[i] - want[i].re, zi[i] - want[i].im)).toBeLessThan(1e-12 * scale);
		}
	});
	test('a singular I + σH (σ = −1/λ for an eigenvalue λ of a triangular H) is refused', () => {
		const h = Float64Array.from([2, 1, 0, 3]);
		const f = shiftedFactorWorkspace(2);
		expect(shiftedFactor(f, h, -0.5, 0)).toBe(false);
	});
});

/** A series RLC band-pass of quality factor q around 1 MHz (ω0 = 1/√(LC), Q = ω0·L/R). */
function resonator(q: number) {
	const L = 1e-6;
	const C = 1 / ((2 * Math.PI * 1e6) ** 2 * L);
	const R = (2 * Math.PI * 1e6 * L) / q;
	return net(
		[
			el('Vin', 'V', ['in', 'gnd'], 1),
			el('L1', 'L', ['in', 'a'], L),
			el('C1', 'C', ['a', 'b'], C),
			el('R1', 'R', ['b', 'gnd'], R),
			el('Cp', 'C', ['b', 'gnd'], C / 50)
		],
		'b'
	);
}

/** Compensated divider with the tip zero a relative `gap` from the pole (a near-cancelling pair),
 *  bridged by extra capacitors so the band is not trivially narrow. */
function doublet(gap: number) {
	const els: El[] = [
		el('Vin', 'V', ['s', 'gnd'], 1),
		el('Rs', 'R', ['s', 'in'], 50),
		el('R1', 'R', ['in', 'o'], 9e6),
		el('C1', 'C', ['in', 'o'], ((1e6 * 100e-12) / 9e6) * (1 + gap)),
		el('R2', 'R', ['o', 'gnd'], 1e6),
		el('C2', 'C', ['o', 'gnd'], 100e-12),
		el('Rx', 'R', ['o', 'x'], 1e3),
		el('Cx', 'C', ['x', 'gnd'], 1e-12),
		el('Cy', 'C', ['x', 'in'], 1e-15)
	];
	return net(els, 'o');
}

function cases(): { name: string; doc: unknown }[] {
	const out: { name: string; doc: unknown }[] = [];
	const kinds: NetworkClass[] = ['rc', 'rc-floating', 'rlc', 'active'];
	for (let i = 0; i < 24; i++) {
		const kind = kinds[i % 4];
		out.push({
			name: `${kind} mesh #${i}`,
			doc: randomNetwork(kind, 30 + ((i * 7) % 50), 900 + i)
		});
	}
	for (const n of [2, 4, 6]) out.push({ name: `buffered RC, ${n}-fold pole`, doc: bufferedRc(n) });
	for (const q of [10, 100, 1000]) out.push({ name: `RLC, Q = ${q}`, doc: resonator(q) });
	for (const gap of [1e-3, 1e-6]) out.push({ name: `doublet ${gap}`, doc: doublet(gap) });
	out.push({ name: 'ten-decade ladder', doc: tenDecadeLadder() });
	out.push({ name: 'LC-line probe', doc: lcProbe(20, 2e-5) });
	out.push({ name: 'CCVS as a resistance', doc: ccvsResistor() });
	out.push({ name: 'divider from an ideal source', doc: stiffDividerNet() });
	return out;
}

/** a − b as a wide number on b's exponent. */
const diff = (a: Wide, b: Wide): Wide => {
	const k = 2 ** (a.ex - b.ex);
	return { re: a.re * k - b.re, im: a.im * k - b.im, ex: b.ex };
};
const logAbsWide = (w: Wide) => Math.log(Math.hypot(w.re, w.im)) + w.ex * Math.LN2;

const relWide = (a: Wide, b: Wide) => {
	if (b.re === 0 && b.im === 0) return a.re === 0 && a.im === 0 ? 0 : Infinity;
	const q = ratio(a, b);
	return Math.hypot(q.re - 1, q.im);
};

/**
 * Both reductions behind the wide-band route: the Hessenberg one (any network) and the modal one
 * (reciprocal networks whose free equations are symmetric definite, modal-route.ts), each forced
 * in turn; a network the forced reduction does not apply to is answered by the LU alone and
 * does not count. Each must apply to enough of the list for the comparison to mean something.
 */
const REDUCTIONS = [
	{ kind: 'hessenberg', applies: 20 },
	{ kind: 'modal', applies: 8 }
] as const;

describe.each(REDUCTIONS)(
	'$kind reduction against the banded LU on the same equations (1e-9)',
	({ kind, applies }) => {
		test('random meshes (RC, floating, RLC, active), repeated poles, Q to 1000, doublets, ten decades, controlled sources', () => {
			let answered = 0;
			let asked = 0;
			let networks = 0;
			const problems: string[] = [];
			routeOverride.reduction = kind;
			for (const { name, doc } of cases()) {
				const a = analyze(doc, { step: false });
				const mags = a.poles.map((p) => Math.hypot(p.re, p.im)).filter((m) => m > 0);
				const lo = Math.min(...mags);
				const hi = Math.max(...mags);
				// The shift the analysis would take: the geometric middle of the spectrum (shift.ts).
				const s0 = Math.sqrt(lo * hi);
				const asm = assemble(validateNetwork(doc), () => 'pencil');
				const viaH = directSystem(asm, s0);
				const viaLU = directSystem(asm, s0);
				viaH.route = 'hessenberg';
				viaLU.route = 'band';
				// jω from far below the slowest to far above the fastest pole; points beside each pole
				// (as the zero checks probe them); complex points; the real axis far out (as H(∞)).
				const pts: [number, number][] = [];
				for (let k = 0; k <= 40; k++)
					pts.push([0, lo * 1e-3 * (hi / lo) ** (k / 40) * 1e6 ** (k / 40)]);
				for (const p of a.poles.slice(0, 8)) pts.push([p.re * 0.5, p.im * 1.5]);
				pts.push([hi * 1e6, 0], [hi * 1e7, 0]);
				solveAt(viaH, pts[0][0], pts[0][1], true);
				if (viaH.reduced?.kind !== kind) continue;
				networks++;
				for (const [sr, si] of pts) {
					const before = viaH.stats.hessenberg;
					const got: DirectPoint | null = solveAt(viaH, sr, si, true);
					const want: DirectPoint | null = solveAt(viaLU, sr, si, true);
					asked++;
					if (viaH.stats.hessenberg === before) continue;
					answered++;
					if (!want) {
						problems.push(`${name} at ${sr}+j${si}: LU says singular, Hessenberg answered`);
						continue;
					}
					for (const [what, x, y] of [
						['H', got!.h, want.h],
						['input functional', got!.zin, want.zin]
					] as const) {
						const e = relWide(x, y);
						if (!(e <= 1e-9)) problems.push(`${name}, ${what} at ${sr}+j${si}: relative ${e}`);
					}
					// dH/ds on the scale of |H|/|s| (the group delay on the scale of 1/ω, as in
					// trust-properties.test.ts): where H′ nearly vanishes its own digits are noise.
					const dd = toComplex(diff(got!.dh!, want.dh!));
					const scale = Math.max(
						logAbsWide(want.dh!),
						logAbsWide(want.h) - Math.log(Math.hypot(sr, si))
					);
					const e = Math.log(Math.hypot(dd.re, dd.im)) - scale;
					if (!(e <= Math.log(1e-9)))
						problems.push(`${name}, dH/ds at ${sr}+j${si}: ${Math.exp(e)}`);
				}
			}
			routeOverride.reduction = null;
			expect(problems, problems.slice(0, 10).join('\n')).toEqual([]);
			// The route must carry the comparison: most points answered by it, not by the fallback.
			expect(networks).toBeGreaterThanOrEqual(applies);
			expect(answered / asked).toBeGreaterThan(0.6);
		});
	}
);

describe.each(REDUCTIONS)(
	'analyze with the $kind reduction against analyze with the banded LU (1e-9)',
	({ kind }) => {
		test('every response field, the bandwidth, H(∞), the zeros and the pairs agree', () => {
			const problems: string[] = [];
			routeOverride.answered = routeOverride.declined = 0;
			routeOverride.reduction = kind;
			const relErr = (a: number | null, b: number | null, scale = Math.abs(b ?? 0)) =>
				a === null || b === null ? (a === b ? 0 : Infinity) : Math.abs(a - b) / (scale || 1e-300);
			for (const { name, doc } of cases()) {
				routeOverride.route = 'hessenberg';
				const viaH = analyze(doc, { step: false });
				routeOverride.route = 'band';
				const viaLU = analyze(doc, { step: false });
				routeOverride.route = null;
				const add = (what: string, e: number, tol = 1e-9) => {
					if (!(e <= tol)) problems.push(`${name}: ${what} differs by ${e}`);
				};
				const fa = viaH.frequencyResponse!;
				const fb = viaLU.frequencyResponse!;
				fa.f.forEach((f, i) => {
					// 1e-9 relative in |H| is 8.7e-9 dB; in the phase, 1e-9 rad.
					add(
						`|H| at ${f} Hz`,
						Math.abs((fa.magnitudeDb[i] ?? 0) - (fb.magnitudeDb[i] ?? 0)),
						8.7e-9
					);
					add(`phase at ${f} Hz`, Math.abs((fa.phaseDeg[i] ?? 0) - (fb.phaseDeg[i] ?? 0)), 5.8e-8);
					add(
						`group delay at ${f} Hz`,
						relErr(
							fa.groupDelay[i],
							fb.groupDelay[i],
							Math.max(Math.abs(fb.groupDelay[i] ?? 0), 1 / (2 * Math.PI * f))
						)
					);
					const za = viaH.inputImpedance?.magnitude[i] ?? null;
					const zb = viaLU.inputImpedance?.magnitude[i] ?? null;
					add(`|Zin| at ${f} Hz`, relErr(za, zb));
				});
				add('bandwidth', relErr(viaH.bandwidth, viaLU.bandwidth));
				add(
					'H(∞)',
					relErr(
						viaH.highFrequencyGain,
						viaLU.highFrequencyGain,
						Math.max(Math.abs(viaLU.highFrequencyGain ?? 0), Math.abs(viaLU.dcGain ?? 0))
					)
				);
				add('zero count', viaH.zeros.length === viaLU.zeros.length ? 0 : Infinity);
				// Zeros, unless the analysis itself says its pole–zero form disagrees with the network
				// equations (then it warns that the lists may be incomplete, in both routes alike).
				const flagged = viaLU.warnings.some((w) => w.code === 'pole_zero_disagreement');
				if (!flagged)
					viaH.zeros.forEach((z, i) => {
						const w = viaLU.zeros[i];
						const d = Math.hypot(z.re - w.re, z.im - w.im);
						add(`zero ${i}`, d === 0 ? 0 : d / Math.hypot(w.re, w.im));
					});
				add('pair count', viaH.pairs.length === viaLU.pairs.length ? 0 : Infinity);
				const codes = (x: typeof viaH) =>
					x.warnings
						.map((w) => w.code)
						.sort()
						.join(',');
				add(
					`warnings ${codes(viaH)} vs ${codes(viaLU)}`,
					codes(viaH) === codes(viaLU) ? 0 : Infinity
				);
			}
			routeOverride.reduction = null;
			expect(problems, problems.slice(0, 12).join('\n')).toEqual([]);
			const { answered, declined } = routeOverride;
			expect(answered / (answered + declined)).toBeGreaterThan(0.6);
		});
	}
);
