import { describe, expect, it } from 'vitest';
import { checkAcross, judgeVariants, type VariantJudged } from './variant-spec';
import type { Metrics } from './evaluate';
import { digitizerDividerRanges } from '../server/db/seed/demo-sheets';
import type { NetworkDocument } from '../network/schema';
import type { CrossSpec } from '../network/design-schema';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

/** Variants with figures chosen by hand, so each spec passes or fails by construction. */
function made(rows: [string, string, Partial<Metrics>][]): VariantJudged[] {
	return rows.map(([range, cable, m]) => ({
		name: `${range} · ${cable}`,
		options: [range, cable],
		figures: {
			poles: [],
			zeros: [],
			dcGain: null,
			bandwidth: null,
			riseTime: null,
			overshoot: null,
			settlingTime: null,
			flatnessDb: null,
			maxQ: null,
			inputResistance: null,
			inputCapacitance: null,
			...m
		} as Metrics,
		spec: null,
		error: null
	}));
}
const groups = [{ name: 'Range' }, { name: 'Cable' }];
const six = made([
	['x1', 'short', { dcGain: 1, inputCapacitance: 20e-12, inputResistance: 1e6 }],
	['x1', 'long', { dcGain: 1, inputCapacitance: 30e-12, inputResistance: 1e6 }],
	['x10', 'short', { dcGain: 0.1, inputCapacitance: 20.3e-12, inputResistance: 1e6 }],
	['x10', 'long', { dcGain: 0.1002, inputCapacitance: 30.6e-12, inputResistance: 1.001e6 }],
	['x100', 'short', { dcGain: 0.01, inputCapacitance: 19.9e-12, inputResistance: 1e6 }],
	['x100', 'long', { dcGain: 0.0097, inputCapacitance: 30e-12, inputResistance: 1e6 }]
]);

describe('cross-variant specs by construction', () => {
	it('equal across a group: judged per choice of the other groups', () => {
		// Short cable: 19.9–20.3 pF, spread 0.4/19.9 = 2.01 %; long: 30–30.6 pF, spread 2.0 %.
		const [ok] = checkAcross(groups, six, [
			{ kind: 'equal', figure: 'inputCapacitance', group: 'Range', tolerance: 0.025 }
		]);
		expect(ok.pass).toBe(true);
		expect(ok.sets.map((s) => s.within)).toEqual(['short', 'long']);
		expect(ok.sets[0].detail).toBe('spread 2.01 %, allowed 2.5 %');
		const [tight] = checkAcross(groups, six, [
			{ kind: 'equal', figure: 'inputCapacitance', group: 'Range', tolerance: 0.015 }
		]);
		expect(tight.pass).toBe(false);
		expect(tight.sets.every((s) => !s.pass)).toBe(true);
	});

	it('equal in every variant: one set of all six (the cable breaks it)', () => {
		const [c] = checkAcross(groups, six, [
			{ kind: 'equal', figure: 'inputCapacitance', tolerance: 0.05 }
		]);
		expect(c.sets).toHaveLength(1);
		expect(c.sets[0].within).toBe('all variants');
		expect(c.pass).toBe(false); // 19.9 to 30.6 pF
		const [r] = checkAcross(groups, six, [
			{ kind: 'equal', figure: 'inputResistance', tolerance: 0.002 }
		]);
		expect(r.pass).toBe(true); // 1 MΩ to 1.001 MΩ: 0.1 %
	});

	it('attenuation ratios 1 : 10 : 100 across Range, per cable', () => {
		const spec: CrossSpec = {
			kind: 'ratio',
			figure: 'attenuation',
			group: 'Range',
			ratios: { x1: 1, x10: 10, x100: 100 },
			tolerance: 0.01
		};
		const [c] = checkAcross(groups, six, [spec]);
		// Short: exact. Long: x100 attenuates 1/0.0097 = 103.1 (3.1 % off) → fails.
		expect(c.sets[0].pass).toBe(true);
		expect(c.sets[1].pass).toBe(false);
		expect(c.sets[1].detail).toMatch(
			/^x100 : x1 is 103\.09 against 100 \(off by 3\.09 %, allowed 1 %\)$/
		);
		expect(c.label).toBe(
			'Attenuation (1/|DC gain|) in the ratio 1 : 10 : 100 across Range (x1, x10, x100), within 1 %'
		);
		// The same steps as gains: 1 : 0.1 : 0.01, stated the other way round.
		const [g] = checkAcross(groups, six, [
			{ ...spec, figure: 'dcGain', ratios: { x1: 100, x10: 10, x100: 1 }, tolerance: 0.04 }
		]);
		expect(g.pass).toBe(true);
	});

	it('a missing figure, a missing group and too few variants fail with the reason', () => {
		const holes = made([
			['x1', 'short', { inputCapacitance: 20e-12 }],
			['x10', 'short', { inputCapacitance: null }]
		]);
		const [a] = checkAcross(groups, holes, [
			{ kind: 'equal', figure: 'inputCapacitance', tolerance: 0.1 }
		]);
		expect(a.pass).toBe(false);
		expect(a.sets[0].detail).toBe('x10 · short has no input capacitance');
		const [b] = checkAcross(groups, six, [
			{ kind: 'equal', figure: 'dcGain', group: 'Switch', tolerance: 0.1 }
		]);
		expect(b.sets[0].detail).toBe('the sheet has no variant group “Switch”');
		const [c] = checkAcross(groups, holes.slice(0, 1), [
			{ kind: 'equal', figure: 'dcGain', tolerance: 0.1 }
		]);
		expect(c.pass).toBe(false);
	});
});

describe('the demo divider: six variants judged on exact figures', () => {
	// Each position compensated by the closed form R_top·C_top = R_shunt·C_shunt for the 1.2 m
	// cable (common practice), so its input capacitance is C_top in series with C_shunt.
	const RADC = 1e6;
	type Position = { rtop: number; rsh: number | null; csh: number };
	const positions: Record<string, Position> = {
		'10:1': { rtop: 9e6, rsh: null, csh: 0 },
		'100:1': { rtop: 9.9e6, rsh: 111.1e3, csh: 540e-12 },
		'1000:1': { rtop: 9.99e6, rsh: 10.1e3, csh: 5940e-12 }
	};
	const shuntR = (rsh: number | null) => 1 / (1 / RADC + (rsh ? 1 / rsh : 0));
	const shuntC = (csh: number, cable: number) => csh + cable + 18e-12;
	const ctop = (p: Position) => (shuntR(p.rsh) * shuntC(p.csh, 42e-12)) / p.rtop;
	const doc = structuredClone(digitizerDividerRanges) as unknown as NetworkDocument;
	doc.elements.find((e) => e.id === 'Ctop')!.value = ctop(positions['10:1']);
	doc.variants!.groups[0].options[1].values!.Ctop = ctop(positions['100:1']);
	doc.variants!.groups[0].options[2].values!.Ctop = ctop(positions['1000:1']);

	const across: CrossSpec[] = [
		{ kind: 'equal', figure: 'inputResistance', tolerance: 1e-4 },
		{
			kind: 'ratio',
			figure: 'attenuation',
			group: 'Range',
			ratios: { '10:1': 1, '100:1': 10, '1000:1': 100 },
			tolerance: 2e-3
		},
		{ kind: 'equal', figure: 'inputCapacitance', group: 'Range', tolerance: 0.05 },
		{ kind: 'equal', figure: 'inputCapacitance', group: 'Range', tolerance: 0.02 }
	];
	const out = judgeVariants(doc, { bandwidthMin: 1e6 }, across);

	it('every variant is judged against the limit; input capacitance is the series combination', () => {
		expect(out.variants).toHaveLength(6);
		for (const v of out.variants) {
			expect(v.error).toBeNull();
			expect(v.spec!.checks.map((c) => c.key)).toEqual(['bandwidth']);
			const [range, cable] = v.options;
			const p = positions[range];
			const c2 = shuntC(p.csh, cable === '2 m cable' ? 70e-12 : 42e-12);
			const c1 = ctop(p);
			// Closed form (series combination): C1·C2/(C1 + C2); the 50 Ω source adds < 1e-5.
			expect(rel(v.figures!.inputCapacitance!, (c1 * c2) / (c1 + c2))).toBeLessThan(1e-4);
			// DC input resistance: R_top + R_shunt (10 MΩ in every position by design).
			expect(rel(v.figures!.inputResistance!, 50 + p.rtop + shuntR(p.rsh))).toBeLessThan(1e-9);
		}
	});

	it('the cross-variant specs pass and fail as the closed forms say', () => {
		const [rin, steps, cin5, cin2] = out.across;
		expect(rin.pass).toBe(true);
		expect(steps.pass).toBe(true);
		expect(steps.sets.map((s) => s.within)).toEqual(['1.2 m cable', '2 m cable']);
		expect(cin5.pass).toBe(true);
		// 1.2 m cable: every position exactly compensated, 6.0 pF each; 2 m cable: 10:1 sees
		// 88 pF of shunt with C_top = 6.67 pF → 6.197 pF against 6.0 pF, 3.3 % — over 2 %.
		expect(cin2.sets[0].pass).toBe(true);
		expect(cin2.sets[1].pass).toBe(false);
		expect(out.pass).toBe(false);
	});
});
