import { describe, expect, test } from 'vitest';
import Complex from 'complex.js';
import { analyze } from '../../../src/lib/solver/index';
import { el, net } from './build';
import { lcProbe } from './trust-networks';

/**
 * The unwrapped phase on coarse grids and across resonances narrower than the grid. Before, the
 * phase was carried from point to point by a trapezoid of the group delay over the whole step:
 * a series RLC with Q = 100 read −25 380° at 7 points (it never leaves 0…−180°), and the 10:1
 * probe example −2 249° at 35 GHz with 5 points (−89.4°). References here never use the solver:
 * closed forms of second-order sections (textbook), and an ABCD-chain evaluation of the LC-line
 * probe with complex.js, unwrapped on a grid fine enough that no step exceeds 30°.
 */

const deg = (r: number) => (r * 180) / Math.PI;

/** Series R–L, shunt C (output across C): −arg(1 − (ω/ω0)² + jω/(ω0·Q)), continuous in (−180°, 0]. */
function rlc(w0: number, Q: number, L = 1e-6) {
	const C = 1 / (w0 * w0 * L);
	const R = Math.sqrt(L / C) / Q;
	return { R, L, C };
}
const rlcPhase = (f: number, w0: number, Q: number) => {
	const x = (2 * Math.PI * f) / w0;
	return -deg(Math.atan2(x / Q, 1 - x * x));
};

function rlcNet(w0: number, Q: number) {
	const { R, L, C } = rlc(w0, Q);
	return net(
		[
			el('Vin', 'V', ['in', 'gnd'], 1),
			el('R1', 'R', ['in', 'a'], R),
			el('L1', 'L', ['a', 'b'], L),
			el('C1', 'C', ['b', 'gnd'], C)
		],
		'b'
	);
}

/** Three RLC sections separated by unity-gain buffers: the phase falls to −540°. */
const stages = [
	{ w0: 2 * Math.PI * 1e4, Q: 200 },
	{ w0: 2 * Math.PI * 3e5, Q: 500 },
	{ w0: 2 * Math.PI * 7e6, Q: 50 }
];
function bufferedResonators() {
	const els = [el('Vin', 'V', ['n0', 'gnd'], 1)];
	stages.forEach(({ w0, Q }, k) => {
		const { R, L, C } = rlc(w0, Q);
		const src = k === 0 ? 'n0' : `o${k - 1}`;
		els.push(
			el(`R${k}`, 'R', [src, `a${k}`], R),
			el(`L${k}`, 'L', [`a${k}`, `b${k}`], L),
			el(`C${k}`, 'C', [`b${k}`, 'gnd'], C),
			el(`E${k}`, 'VCVS', [`o${k}`, 'gnd', `b${k}`, 'gnd'], 1)
		);
	});
	return net(els, `o${stages.length - 1}`);
}

/** H(jω) of the probe by walking the ladder back from its load (ABCD chain), complex.js. */
function probeH(f: number, doc: ReturnType<typeof lcProbe>): Complex {
	const s = new Complex(0, 2 * Math.PI * f);
	const val = (id: string) => Number(doc.elements.find((e) => e.id === id)!.value);
	const sections = doc.elements.filter((e) => e.type === 'L').length;
	let v = new Complex(1, 0);
	let i = v.mul(s.mul(val('Cin')).add(1 / val('Rin')));
	for (let k = sections; k >= 1; k--) {
		i = i.add(v.mul(s.mul(val(`C${k}`))));
		v = v.add(i.mul(s.mul(val(`L${k}`))));
	}
	const zTip = new Complex(val('Rt')).div(s.mul(val('Rt') * val('Ct')).add(1));
	v = v.add(i.mul(zTip));
	v = v.add(i.mul(val('Rs')));
	return new Complex(1, 0).div(v);
}

/**
 * The continuous phase of the probe at each of `fs`, followed along a fine log grid; a step
 * whose wrapped change is 5° or more is split in log-frequency until each part is under 5°.
 */
function probePhaseRef(fs: number[], doc: ReturnType<typeof lcProbe>): number[] {
	const arg = (f: number) => probeH(f, doc).arg();
	const wrap = (d: number) => d - 2 * Math.PI * Math.round(d / (2 * Math.PI));
	const LIMIT = (5 * Math.PI) / 180;
	const change = (fa: number, aa: number, fb: number, ab: number, depth: number): number => {
		const d = wrap(ab - aa);
		if (Math.abs(d) < LIMIT || depth > 60) return d;
		const fm = Math.sqrt(fa * fb);
		const am = arg(fm);
		return change(fa, aa, fm, am, depth + 1) + change(fm, am, fb, ab, depth + 1);
	};
	// A base grid of 20 000 log points (0.1 % apart over the probe's nine decades, finer than
	// any resonance of the line) so that no turn can hide between two samples of equal phase.
	const n = 20_000;
	const lo = Math.log(fs[0]);
	const hi = Math.log(fs[fs.length - 1]);
	const grid = [...fs, ...Array.from({ length: n + 1 }, (_, k) => Math.exp(lo + ((hi - lo) * k) / n))]
		.filter((f) => f >= fs[0] && f <= fs[fs.length - 1])
		.sort((a, b) => a - b);
	const at = new Map<number, number>();
	let phase = arg(grid[0]); // the probe's phase starts near 0 at low frequency
	at.set(grid[0], phase);
	for (let k = 1; k < grid.length; k++) {
		phase += change(grid[k - 1], arg(grid[k - 1]), grid[k], arg(grid[k]), 0);
		at.set(grid[k], phase);
	}
	return fs.map((f) => deg(at.get(f)!));
}

describe('unwrapped phase against outside references', () => {
	for (const Q of [10, 100, 1000])
		for (const points of [7, 200])
			test(`series RLC, Q = ${Q}, ${points} points: the closed form (textbook)`, () => {
				const w0 = 2 * Math.PI * 1e6;
				const a = analyze(rlcNet(w0, Q), { frequency: { points }, step: false });
				const fr = a.frequencyResponse!;
				fr.f.forEach((f, k) => {
					const want = rlcPhase(f, w0, Q);
					expect(Math.abs(fr.phaseDeg[k]! - want), `${f} Hz: ${fr.phaseDeg[k]} vs ${want}`).toBeLessThan(1e-6);
				});
			});

	for (const points of [9, 60])
		test(`three buffered resonators (Q 50–500), ${points} points: the sum of three closed forms, down to −540°`, () => {
			const a = analyze(bufferedResonators(), { frequency: { points, fMin: 10, fMax: 1e9 }, step: false });
			const fr = a.frequencyResponse!;
			fr.f.forEach((f, k) => {
				const want = stages.reduce((sum, { w0, Q }) => sum + rlcPhase(f, w0, Q), 0);
				expect(Math.abs(fr.phaseDeg[k]! - want), `${f} Hz: ${fr.phaseDeg[k]} vs ${want}`).toBeLessThan(1e-6);
			});
			expect(fr.phaseDeg.at(-1)!).toBeLessThan(-530);
		});

	for (const points of [5, 200])
		test(`10:1 probe on a 20-section LC line, ${points} points: an ABCD-chain evaluation unwrapped finely`, () => {
			const doc = lcProbe();
			const a = analyze(doc, { frequency: { points }, step: false });
			const fr = a.frequencyResponse!;
			const want = probePhaseRef(fr.f, doc);
			fr.f.forEach((f, k) => {
				expect(
					Math.abs(fr.phaseDeg[k]! - want[k]),
					`${f.toPrecision(4)} Hz: ${fr.phaseDeg[k]} vs ${want[k]}`
				).toBeLessThan(1e-5 * Math.max(1, Math.abs(want[k])));
			});
			expect(a.warnings.map((w) => w.code)).not.toContain('phase_unresolved');
		});

	test('a 300-section LC line through the sparse back end: phase and group delay against an ABCD-chain evaluation', () => {
		// 600 reactive elements: above the dense path's size, so analyze() takes the sparse path.
		const N = 300;
		const L = 250e-9 / 30;
		const C = 100e-12 / 30;
		const els = [el('Vin', 'V', ['x', 'gnd'], 1), el('Rs', 'R', ['x', 'n0'], 50)];
		for (let k = 1; k <= N; k++)
			els.push(el(`L${k}`, 'L', [`n${k - 1}`, `n${k}`], L), el(`C${k}`, 'C', [`n${k}`, 'gnd'], C));
		els.push(el('RL', 'R', [`n${N}`, 'gnd'], 50));
		const doc = net(els, `n${N}`);
		const a = analyze(doc, { frequency: { points: 40 }, step: false });
		expect(a.meta.backend).toBe('sparse');
		// 1/H by walking back from the load in plain complex arithmetic (re, im), for speed.
		const arg = (f: number) => {
			const w = 2 * Math.PI * f;
			let [vr, vi] = [1, 0];
			let [ir, ii] = [1 / 50, 0];
			for (let k = N; k >= 1; k--) {
				[ir, ii] = [ir - vi * w * C, ii + vr * w * C];
				[vr, vi] = [vr - ii * w * L, vi + ir * w * L];
				// Far above the band |1/H| passes 1e308: a positive scale leaves the argument as is.
				const big = Math.max(Math.abs(vr), Math.abs(vi));
				if (big > 1e100) [vr, vi, ir, ii] = [vr / big, vi / big, ir / big, ii / big];
			}
			return -Math.atan2(vi + ii * 50, vr + ir * 50);
		};
		const fr = a.frequencyResponse!;
		// Reference phase: followed along a fine grid (500 log steps between output points),
		// each step split until its wrapped change is under 5°.
		const wrap = (d: number) => d - 2 * Math.PI * Math.round(d / (2 * Math.PI));
		const change = (fa: number, fb: number, depth: number): number => {
			const d = wrap(arg(fb) - arg(fa));
			if (!Number.isFinite(d)) throw new Error(`reference lost at ${fa} Hz`);
			if (Math.abs(d) < (5 * Math.PI) / 180 || depth > 40) return d;
			const fm = Math.sqrt(fa * fb);
			return change(fa, fm, depth + 1) + change(fm, fb, depth + 1);
		};
		const across = (fa: number, fb: number) => {
			let sum = 0;
			const m = 500;
			for (let j = 0; j < m; j++)
				sum += change(fa * (fb / fa) ** (j / m), fa * (fb / fa) ** ((j + 1) / m), 0);
			return sum;
		};
		let phase = arg(fr.f[0]);
		fr.f.forEach((f, k) => {
			if (k > 0) phase += across(fr.f[k - 1], f);
			const got = fr.phaseDeg[k];
			if (got === null) {
				// Only where the follower ran out of time, and then it says so.
				expect(a.warnings.map((w) => w.code)).toContain('phase_unresolved');
				return;
			}
			expect(Math.abs(got - deg(phase)), `${f.toPrecision(4)} Hz: ${got} vs ${deg(phase)}`).toBeLessThan(
				1e-6 * Math.max(1, Math.abs(deg(phase)))
			);
			// Group delay: −dφ/dω by a central difference of the reference at ±1e-5 (relative).
			const e = 1e-5;
			const want = -wrap(arg(f * (1 + e)) - arg(f * (1 - e))) / (2 * Math.PI * f * 2 * e);
			expect(Math.abs(fr.groupDelay[k]! - want) / Math.abs(want), `τg at ${f.toPrecision(4)} Hz`).toBeLessThan(1e-4);
		});
		// Most of the sweep must be followed (the line turns by about 300 × 180° up its band).
		expect(fr.phaseDeg.filter((p) => p !== null).length).toBeGreaterThan(30);
	});

	for (const points of [7, 200])
		test(`a lossless notch (series L–C to ground), ${points} points: the phase turns up by 180° at the notch, as its lossy limit does`, () => {
			// H = (s²LC + 1)/(s²LC + sRC + 1): a zero pair on the jω axis at ω0 = 1/√(LC). A zero
			// with the least loss sits just left of the axis and lifts the phase by 180° as ω
			// passes it, so φ = (ω > ω0 ? 180° : 0°) − atan2(ωRC, 1 − ω²LC) (textbook).
			const [R, L, C] = [50, 1e-6, 1e-9];
			const w0 = 1 / Math.sqrt(L * C);
			const doc = net(
				[
					el('Vin', 'V', ['in', 'gnd'], 1),
					el('R1', 'R', ['in', 'out'], R),
					el('L1', 'L', ['out', 'm'], L),
					el('C1', 'C', ['m', 'gnd'], C)
				],
				'out'
			);
			const a = analyze(doc, { frequency: { points }, step: false });
			const fr = a.frequencyResponse!;
			fr.f.forEach((f, k) => {
				const w = 2 * Math.PI * f;
				if (Math.abs(w / w0 - 1) < 1e-9) return; // on the notch itself H = 0: no phase
				const want = (w > w0 ? 180 : 0) - deg(Math.atan2(w * R * C, 1 - w * w * L * C));
				expect(Math.abs(fr.phaseDeg[k]! - want), `${f} Hz: ${fr.phaseDeg[k]} vs ${want}`).toBeLessThan(1e-6);
			});
		});
});
