// A three-position compensated attenuator held as the variants of one sheet, checked against
// closed forms. Source for both (common practice; the standard textbook treatment of the
// compensated attenuator and the passive probe): with series arm R1 ∥ C1 and shunt arm R2 ∥ C2,
//   - the response is flat, H(s) = R2/(R1 + R2) at every s, exactly when R1·C1 = R2·C2;
//   - the input admittance is then Y(s) = (1 + s·τ)/(R1 + R2) with τ = R1·C1, so the input
//     capacitance Im(Y)/ω is C1·C2/(C1 + C2) (C1 in series with C2) at every frequency, and the
//     input resistance is R1 + R2.
// Here R2 and C2 are the shunt totals: the buffer's 1 MΩ ∥ 18 pF in parallel with the position's
// shunt parts (parallel combination: conductances and capacitances add).
import { describe, expect, it } from 'vitest';
import { analyze, frequencyResponseAt } from '../../../src/lib/solver';
import { listVariants, resolveVariant } from '../../../src/lib/network/variants';
import { solveForValue } from '../../../src/lib/design/solve-for-value';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
const RLOAD = 1e6;
const CLOAD = 18e-12;

/** Positions: series arm and added shunt parts; the ×2 position puts in a shunt trimmer of its own. */
const POSITIONS = [
	{ name: '÷2', r1: 500e3, rsh: null, csh: 2e-12, trim: 4.7e-12 },
	{ name: '÷10', r1: 900e3, rsh: 111.111e3, csh: 160e-12, trim: null },
	{ name: '÷100', r1: 990e3, rsh: 10.101e3, csh: 1.8e-9, trim: null }
];
const shunt = (p: (typeof POSITIONS)[number]) => ({
	r2: 1 / (1 / RLOAD + (p.rsh ? 1 / p.rsh : 0)),
	c2: CLOAD + p.csh + (p.trim ?? 0)
});
/** The closed-form flat condition, solved for C1. */
const flatC1 = (p: (typeof POSITIONS)[number]) => (shunt(p).r2 * shunt(p).c2) / p.r1;

function attenuator(c1: (p: (typeof POSITIONS)[number]) => number) {
	return {
		schema: 1 as const,
		title: 'Three-position attenuator',
		elements: [
			{ id: 'Vin', type: 'V' as const, nodes: ['in', 'gnd'], value: 1 },
			{ id: 'R1', type: 'R' as const, nodes: ['in', 'out'], value: POSITIONS[0].r1 },
			{ id: 'C1', type: 'C' as const, nodes: ['in', 'out'], value: c1(POSITIONS[0]) },
			{ id: 'Rsh', type: 'R' as const, nodes: ['out', 'gnd'], value: 1e5 },
			{ id: 'Csh', type: 'C' as const, nodes: ['out', 'gnd'], value: POSITIONS[0].csh },
			{ id: 'Ctrim', type: 'C' as const, nodes: ['out', 'gnd'], value: 4.7e-12 },
			{ id: 'Rload', type: 'R' as const, nodes: ['out', 'gnd'], value: RLOAD },
			{ id: 'Cload', type: 'C' as const, nodes: ['out', 'gnd'], value: CLOAD }
		],
		input: 'Vin',
		output: { node: 'out' },
		variants: {
			// Rsh is in the ÷10 and ÷100 positions only; the trimmer in ÷2 only.
			absent: ['Rsh'],
			groups: [
				{
					name: 'Range',
					options: POSITIONS.map((p, i) =>
						i === 0
							? { name: p.name }
							: {
									name: p.name,
									values: { R1: p.r1, C1: c1(p), Rsh: p.rsh!, Csh: p.csh },
									present: ['Rsh'],
									absent: ['Ctrim']
								}
					)
				}
			]
		}
	};
}

describe('three-position compensated attenuator (closed forms, common practice)', () => {
	const doc = attenuator(flatC1);
	const variants = listVariants(doc);

	it('has one variant per position', () => {
		expect(variants.map((v) => v.name)).toEqual(['÷2', '÷10', '÷100']);
	});

	it.each(POSITIONS.map((p, i) => [p.name, i] as const))(
		'%s at R1·C1 = R2·C2: DC gain R2/(R1+R2), flat magnitude, the poles cancelled by zeros',
		(_name, i) => {
			const p = POSITIONS[i];
			const { r2 } = shunt(p);
			const a = analyze(resolveVariant(doc, variants[i]));
			const ratio = r2 / (p.r1 + r2);
			expect(rel(a.dcGain!, ratio)).toBeLessThan(1e-9);
			// Flat: every sampled magnitude equals the DC ratio (within 1e-6 dB).
			const db = 20 * Math.log10(ratio);
			for (const m of a.frequencyResponse!.magnitudeDb)
				expect(Math.abs(m! - db)).toBeLessThan(1e-6);
			// The pole at −1/τ of the arm time constant sits on a zero.
			expect(a.poles[0].cancelledBy).not.toBeNull();
			expect(rel(-a.poles[0].re, 1 / (p.r1 * flatC1(p)))).toBeLessThan(1e-6);
		}
	);

	it.each(POSITIONS.map((p, i) => [p.name, i] as const))(
		'%s: input capacitance C1·C2/(C1+C2) and input resistance R1+R2 at every frequency',
		(_name, i) => {
			const p = POSITIONS[i];
			const { r2, c2 } = shunt(p);
			const c1 = flatC1(p);
			const freqs = [1, 1e3, 1e5, 1e7];
			const { zin } = frequencyResponseAt(resolveVariant(doc, variants[i]), freqs);
			freqs.forEach((f, k) => {
				const z = zin[k]!;
				const d = z.re * z.re + z.im * z.im;
				const y = { re: z.re / d, im: -z.im / d };
				expect(rel(y.im / (2 * Math.PI * f), (c1 * c2) / (c1 + c2))).toBeLessThan(1e-7);
				expect(rel(1 / y.re, p.r1 + r2)).toBeLessThan(1e-7);
			});
		}
	);

	it('solving C1 for a flat response per position lands on R2·C2/R1 of that position', () => {
		// Start every position mis-trimmed by +20 %, then solve each one on its own variant.
		const off = attenuator((p) => flatC1(p) * 1.2);
		for (const [i, v] of listVariants(off).entries()) {
			const p = POSITIONS[i];
			const r = solveForValue(resolveVariant(off, v), {
				element: 'C1',
				goal: { kind: 'flat' },
				range: { from: flatC1(p) / 5, to: flatC1(p) * 5 }
			});
			expect(rel(r.value, flatC1(p))).toBeLessThan(1e-4);
		}
	});

	it('mis-compensated: the step jumps to the capacitive ratio C1/(C1+C2) (closed form)', () => {
		const off = attenuator((p) => flatC1(p) * 1.5);
		for (const [i, v] of listVariants(off).entries()) {
			const p = POSITIONS[i];
			const c1 = flatC1(p) * 1.5;
			const a = analyze(resolveVariant(off, v));
			expect(rel(a.highFrequencyGain!, c1 / (c1 + shunt(p).c2))).toBeLessThan(1e-9);
		}
	});
});
