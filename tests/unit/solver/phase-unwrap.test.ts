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
});
