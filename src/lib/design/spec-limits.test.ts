import { describe, expect, it } from 'vitest';
import { analyze } from '../solver';
import { digitizerDivider } from '../server/db/seed/demo-sheets';
import { specLimitsSchema } from '../network/design-schema';
import { checkSpec, figuresOfAnalysis, optionsFor } from './spec-limits';
import { evaluateWith, openVariants } from './variants';

const rc = {
	schema: 1,
	elements: [
		{ id: 'Vin', type: 'V', nodes: ['in', 'gnd'], value: 1 },
		{ id: 'R', type: 'R', nodes: ['in', 'out'], value: '1k' },
		{ id: 'C', type: 'C', nodes: ['out', 'gnd'], value: '100n' }
	],
	input: 'Vin',
	output: { node: 'out' }
};

describe('spec limits', () => {
	it('judges an RC low-pass: f3 = 1/(2πRC) = 1.5915 kHz, rise time 2.197·RC (closed forms)', () => {
		const spec = {
			bandwidthMin: 1.5e3,
			riseTimeMax: 2.3e-4,
			overshootMax: 0.1,
			dcGain: { min: 0.99, max: 1.01 },
			inputResistanceMin: 900
		};
		const m = evaluateWith(openVariants(rc), {}, optionsFor(spec));
		const out = checkSpec(spec, m);
		expect(out.checks.map((c) => [c.key, c.pass])).toEqual([
			['bandwidth', true],
			['riseTime', true],
			['overshoot', true],
			['dcGain', true],
			['inputResistance', true]
		]);
		expect(out.pass).toBe(true);
		const tight = checkSpec({ ...spec, bandwidthMin: 1.6e3, riseTimeMax: 2.1e-4 }, m);
		expect(tight.pass).toBe(false);
		expect(tight.checks.filter((c) => !c.pass).map((c) => c.key)).toEqual([
			'bandwidth',
			'riseTime'
		]);
		expect(tight.checks[0].shown).toBe('1.592 kHz');
	});

	it('input capacitance of an RC seen through its resistor: Y = jωC/(1 + jωRC) ⇒ C/(1 + (ωRC)²) (closed form)', () => {
		const spec = { inputCapacitanceMax: 1e-6, inputCapacitanceAt: 1e3 };
		const m = evaluateWith(openVariants(rc), {}, optionsFor(spec));
		const wrc = 2 * Math.PI * 1e3 * 1e3 * 100e-9;
		expect(m.inputCapacitance! / (100e-9 / (1 + wrc * wrc))).toBeCloseTo(1, 9);
		// The analysis' sampled impedance gives the same figure to its sampling.
		const a = analyze(rc, { frequency: { points: 2000 } });
		expect(figuresOfAnalysis(a, spec).inputCapacitance! / m.inputCapacitance!).toBeCloseTo(1, 3);
	});

	it('a figure that does not exist fails its limit, and the flatness band is read from the analysis too', () => {
		const spec = { bandwidthMin: 1e3, flatness: { withinDb: 0.1, fLo: 10, fHi: 1e6 } };
		const a = analyze(digitizerDivider);
		const fromAnalysis = checkSpec(spec, figuresOfAnalysis(a, spec));
		const exact = checkSpec(
			spec,
			evaluateWith(openVariants(digitizerDivider), {}, optionsFor(spec))
		);
		expect(fromAnalysis.checks[1].value!).toBeCloseTo(exact.checks[1].value!, 2);
		expect(exact.checks[1].pass).toBe(false);
		const none = checkSpec({ bandwidthMin: 1 }, { bandwidth: null } as never);
		expect(none.checks[0]).toMatchObject({ pass: false, shown: 'not defined' });
	});

	it('schema refuses inverted ranges with a field path', () => {
		const r = specLimitsSchema.safeParse({ flatness: { withinDb: 1, fLo: 1e6, fHi: 10 } });
		expect(r.success).toBe(false);
		expect(r.error!.issues[0].path).toEqual(['flatness', 'fHi']);
		expect(specLimitsSchema.safeParse({ dcGain: { min: 2, max: 1 } }).success).toBe(false);
		expect(specLimitsSchema.safeParse({ bandwidth: 1 }).success).toBe(false);
	});
});
