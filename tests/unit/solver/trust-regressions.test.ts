import { describe, expect, test } from 'vitest';
import { Fraction } from 'fraction.js';
import { analyze, frequencyResponseAt } from '../../../src/lib/solver/index';
import { expectRel } from './helpers';
import { degree, exactResponse, exactTransfer } from './exact-rational';
import {
	bufferedRc,
	ccvsResistor,
	lcProbe,
	stiffDivider,
	stiffDividerNet,
	tenDecadeLadder
} from './trust-networks';

/**
 * Issue 12's five examples of silent wrong numbers, as named regressions (our own instances of
 * the classes described there). Each failed before the responses came from the network
 * equations; each reference is outside the solver's pole–zero form: a closed form, exact
 * rational arithmetic (fraction.js), or the dense complex solve frequencyResponseAt.
 */

/** First −3 dB crossing of |H|, scanning 4000 log points of the dense direct solve
 *  (frequencyResponseAt, independent of analyze), then bisection in that bracket. */
function denseBandwidth(doc: unknown, dc: number, lo: number, hi: number): number {
	const mag = (f: number) => {
		const h = frequencyResponseAt(doc, [f]).h[0];
		return Math.hypot(h.re, h.im);
	};
	const target = Math.abs(dc) / Math.SQRT2;
	const n = 4000;
	let a = Math.log(lo);
	let b = Math.log(hi);
	for (let i = 1; i <= n; i++) {
		const x = Math.log(lo) + ((Math.log(hi) - Math.log(lo)) * i) / n;
		if (mag(Math.exp(x)) < target) {
			b = x;
			a = x - (Math.log(hi) - Math.log(lo)) / n;
			break;
		}
	}
	for (let k = 0; k < 200 && b - a > 1e-14; k++) {
		const m = (a + b) / 2;
		if (mag(Math.exp(m)) < target) b = m;
		else a = m;
	}
	return Math.exp((a + b) / 2);
}

describe('issue 12 example 1: 10:1 probe with a 20-section LC cable, tip zero 2e-5 from a pole', () => {
	const doc = lcProbe(20, 2e-5);
	const a = analyze(doc);
	test("the tip zero is reported at −1/(Rt·Ct) (closed form: the series arm's pole), paired with its pole", () => {
		const Ct = Number(doc.elements.find((e) => e.id === 'Ct')!.value);
		const z = a.zeros.find((x) => Math.abs(x.re + 1 / (9e6 * Ct)) < 1e-6 / (9e6 * Ct));
		expect(z, `zeros: ${JSON.stringify(a.zeros.map((x) => x.re))}`).toBeDefined();
		expect(a.pairs.length).toBeGreaterThanOrEqual(1);
		const pair = a.pairs.find((p) => a.zeros[p.zero] === z)!;
		expect(pair.distance).toBeGreaterThan(1e-5);
		expect(pair.distance).toBeLessThan(4e-5);
	});
	test('no right-half-plane zero (the transfer has exactly one finite zero)', () => {
		expect(a.zeros.filter((x) => x.re > 0)).toEqual([]);
		expect(a.zeros).toHaveLength(1);
	});
	test('|H| at 14 Hz is −20 dB (quasi-static closed form Z2/(Rs + Z1 + Z2); 1e-9)', () => {
		const b = analyze(doc, { frequency: { fMin: 14, fMax: 1e9, points: 50 } });
		const w = 2 * Math.PI * 14;
		const Ct = Number(doc.elements.find((e) => e.id === 'Ct')!.value);
		const z1 = cdiv({ re: 9e6, im: 0 }, { re: 1, im: w * 9e6 * Ct });
		const z2 = cdiv({ re: 1e6, im: 0 }, { re: 1, im: w * 1e6 * 135e-12 });
		const h = cdiv(z2, { re: 25 + z1.re + z2.re, im: z1.im + z2.im });
		expectRel(
			b.frequencyResponse!.magnitudeDb[0],
			20 * Math.log10(Math.hypot(h.re, h.im)),
			1e-9,
			'|H(14 Hz)| dB'
		);
	});
	test("the −3 dB bandwidth equals the dense direct solve's (1e-6)", () => {
		// The line's ripple near its cut-off dips below −3 dB first around 1 GHz: scan finely there.
		const ref = denseBandwidth(doc, a.dcGain!, 3e8, 1.1e9);
		expectRel(a.bandwidth, ref, 1e-6, 'bandwidth');
		expect(a.warnings.map((w) => w.code)).not.toContain('pole_zero_disagreement');
	});
	test("H(∞) is exactly 0 (the line's inductors open at infinite frequency)", () => {
		expect(a.highFrequencyGain).toBe(0);
	});
});

function cdiv(a: { re: number; im: number }, b: { re: number; im: number }) {
	const d = b.re * b.re + b.im * b.im;
	return { re: (a.re * b.re + a.im * b.im) / d, im: (a.im * b.re - a.re * b.im) / d };
}

describe('issue 12 example 2: compensated divider driven with no source resistance', () => {
	const { R1, C1, R2, C2 } = stiffDivider;
	const doc = stiffDividerNet();
	test('input impedance at 154 kHz = R1/(1+sR1C1) + R2/(1+sR2C2) (closed form; 1e-9)', () => {
		const a = analyze(doc, { frequency: { fMin: 154e3, fMax: 1e8, points: 20 } });
		const w = 2 * Math.PI * 154e3;
		const z1 = cdiv({ re: R1, im: 0 }, { re: 1, im: w * R1 * C1 });
		const z2 = cdiv({ re: R2, im: 0 }, { re: 1, im: w * R2 * C2 });
		const z = { re: z1.re + z2.re, im: z1.im + z2.im };
		expectRel(a.inputImpedance!.magnitude[0], Math.hypot(z.re, z.im), 1e-9, '|Zin|');
		expectRel(
			a.inputImpedance!.phaseDeg[0],
			(Math.atan2(z.im, z.re) * 180) / Math.PI,
			1e-9,
			'arg Zin'
		);
	});
	test('H(∞) = C1/(C1 + C2) (closed form: the capacitive divider; 1e-12)', () => {
		expectRel(analyze(doc).highFrequencyGain, C1 / (C1 + C2), 1e-12, 'H(∞)');
	});
	test('DC input impedance R1 + R2 (closed form)', () => {
		expectRel(analyze(doc).inputImpedance!.dc!.re, R1 + R2, 1e-12, 'Zin(0)');
	});
});

describe('issue 12 example 3: four equal RC sections between unity-gain buffers (fourfold pole)', () => {
	const a = analyze(bufferedRc(4));
	test('H(∞) is exactly 0 (strictly proper: relative degree 4)', () => {
		expect(a.highFrequencyGain).toBe(0);
	});
	// Closed form: y(t) = 1 − e^{−x}(1 + x + x²/2 + x³/6), x = t/RC (the Erlang-4 distribution).
	const y = (t: number) => {
		const x = t / 1e-5;
		return 1 - Math.exp(-x) * (1 + x + (x * x) / 2 + (x * x * x) / 6);
	};
	const when = (level: number) => {
		let lo = 0;
		let hi = 1e-3;
		for (let k = 0; k < 200; k++) {
			const mid = (lo + hi) / 2;
			if (y(mid) < level) lo = mid;
			else hi = mid;
		}
		return (lo + hi) / 2;
	};
	test('step: 10–90 % rise time and 1 % settling time of the closed form (1e-6), no overshoot', () => {
		expect(a.step).not.toBeNull();
		expectRel(a.step!.riseTime, when(0.9) - when(0.1), 1e-6, 'rise time');
		expectRel(a.step!.settlingTime, when(0.99), 1e-6, 'settling time');
		expect(a.step!.overshoot).toBeLessThan(1e-9);
		expect(a.warnings.map((w) => w.code)).not.toContain('step_untrusted');
	});
	test('step curve: every sample equals the closed form (1e-9 of the final value)', () => {
		a.step!.t.forEach((t, i) => expect(Math.abs(a.step!.y[i] - y(t))).toBeLessThan(1e-9));
	});
	test('the −3 dB bandwidth is √(2^{1/4} − 1)/(2πRC) (closed form for (1 + sRC)⁻⁴; 1e-9)', () => {
		expectRel(a.bandwidth, Math.sqrt(2 ** 0.25 - 1) / (2 * Math.PI * 1e-5), 1e-9, 'bandwidth');
	});
});

describe('issue 12 example 4: a CCVS used as a 30 Ω resistance', () => {
	test('short-circuit resistance seen by C1 is 375 Ω ∥ 30 Ω = 27.78 Ω (closed form)', () => {
		const a = analyze(ccvsResistor(), { frequency: false, step: false });
		expectRel(a.timeConstants.shortCircuit[0].resistance, (375 * 30) / 405, 1e-12, 'R_sc(C1)');
	});
});

describe('issue 12 example 5: RC ladder spanning ten decades (1 Ω … 10 GΩ, 1 mF … 1 fF)', () => {
	const doc = tenDecadeLadder();
	const a = analyze(doc);
	const exactH = exactTransfer(doc);
	test('no zeros: the exact numerator (fraction.js) is a constant', () => {
		expect(degree(exactH.num)).toBe(0);
		expect(a.zeros).toEqual([]);
	});
	test("as many poles as the exact denominator's degree", () => {
		expect(a.poles).toHaveLength(degree(exactH.den));
	});
	test('|H| at the top of the grid equals the exact rational value (1e-9 in dB)', () => {
		const fr = a.frequencyResponse!;
		const i = fr.f.length - 1;
		// ω as an exact rational of the double 2π·f the solver used.
		const w = 2 * Math.PI * fr.f[i];
		const ref = exactResponse(exactH, exactOf(w));
		expectRel(fr.magnitudeDb[i], ref.db, 1e-9, `|H| at ${fr.f[i]} Hz`);
	});
	test('DC input impedance is infinite (null): the source draws no DC current', () => {
		expect(a.inputImpedance!.dc).toBeNull();
	});
	test('H(∞) is exactly 0', () => {
		expect(a.highFrequencyGain).toBe(0);
	});
});

function exactOf(x: number): Fraction {
	let e = 0;
	let m = x;
	while (!Number.isInteger(m)) {
		m *= 2;
		e--;
	}
	return new Fraction(BigInt(m), 2n ** BigInt(-e));
}
