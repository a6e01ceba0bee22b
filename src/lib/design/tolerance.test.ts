import { describe, expect, it } from 'vitest';
import { digitizerDivider } from '../server/db/seed/demo-sheets';
import { monteCarlo, monteCarloChunk, summarize } from './tolerance';
import { openVariants } from './variants';
import { worstCase } from './worst-case';

const divider = {
	schema: 1,
	elements: [
		{ id: 'V1', type: 'V', nodes: ['in', 'gnd'], value: 1 },
		{ id: 'R1', type: 'R', nodes: ['in', 'out'], value: 9000 },
		{ id: 'R2', type: 'R', nodes: ['out', 'gnd'], value: 1000 }
	],
	input: 'V1',
	output: { node: 'out' }
};

describe('Monte Carlo', () => {
	// JCGM 100:2008 (GUM) §5.1.2, first-order law of propagation: for k = R2/(R1 + R2),
	// u²(k) = (∂k/∂R1)² u²(R1) + (∂k/∂R2)² u²(R2), ∂k/∂R1 = −R2/(R1+R2)², ∂k/∂R2 = R1/(R1+R2)².
	// Standard uncertainties: uniform ±t → t·R/√3 (GUM 4.3.7); normal with t = 3σ → t·R/3.
	it.each([
		{ distribution: 'uniform', divisor: Math.sqrt(3) },
		{ distribution: 'normal', divisor: 3 }
	] as const)(
		'resistive divider ratio, $distribution ±1 percent: mean and σ agree with the GUM within the statistical error',
		({ distribution, divisor }) => {
			const N = 10_000;
			const t = 0.01;
			const r = monteCarlo(divider, {
				tolerances: ['R1', 'R2'].map((element) => ({ element, tolerance: t, distribution })),
				runs: N,
				seed: 7
			});
			const gain = r.figures.find((f) => f.figure === 'dcGain')!.stats;
			const [R1, R2] = [9000, 1000];
			const k = R2 / (R1 + R2);
			const u = Math.hypot(
				(R2 / (R1 + R2) ** 2) * ((t * R1) / divisor),
				(R1 / (R1 + R2) ** 2) * ((t * R2) / divisor)
			);
			expect(gain.count).toBe(N);
			// Mean: standard error σ/√N; the second-order bias (≈1e-6 here) is far below it. 4 SE.
			expect(Math.abs(gain.mean - k)).toBeLessThan((4 * u) / Math.sqrt(N));
			// Standard deviation: its standard error is about σ/√(2(N−1)) for a near-normal figure. 4 SE.
			expect(Math.abs(gain.std - u)).toBeLessThan((4 * u) / Math.sqrt(2 * (N - 1)));
		},
		60_000
	);

	it('is reproducible from its seed whatever the chunking, and a different seed differs', () => {
		const req = {
			tolerances: [
				{ element: 'Ctop', tolerance: 0.05, distribution: 'uniform' as const },
				{ element: 'Radc', tolerance: 0.01, distribution: 'normal' as const }
			],
			runs: 60,
			seed: 42
		};
		const v = openVariants(digitizerDivider);
		const whole = monteCarloChunk(v, req, 0, 60);
		const split = [...monteCarloChunk(v, req, 0, 17), ...monteCarloChunk(v, req, 17, 60)];
		expect(split).toEqual(whole);
		const other = monteCarloChunk(v, { ...req, seed: 43 }, 0, 60);
		expect(other).not.toEqual(whole);
		const s = summarize(v, req, whole);
		expect(
			s.figures.find((f) => f.figure === 'bandwidth')!.histogram.counts.reduce((a, b) => a + b, 0)
		).toBe(60);
	});

	it('counts yield against spec limits and says which limit bites', () => {
		const r = monteCarlo(digitizerDivider, {
			tolerances: [{ element: 'Ctop', tolerance: 0.1, distribution: 'uniform' }],
			runs: 400,
			seed: 3,
			spec: { flatness: { withinDb: 0.3, fLo: 10, fHi: 1e6 }, dcGain: { min: 0.09, max: 0.11 } }
		});
		expect(r.yield!.runs).toBe(400);
		expect(r.yield!.fraction).toBeGreaterThan(0.2);
		expect(r.yield!.fraction).toBeLessThan(1);
		expect(r.yield!.byCheck.find((c) => c.key === 'dcGain')!.fraction).toBe(1);
		expect(r.yield!.byCheck.find((c) => c.key === 'flatness')!.fraction).toBeCloseTo(
			r.yield!.fraction,
			12
		);
	});

	it('stops when cancelled and reports progress', () => {
		const seen: number[] = [];
		const signal = { aborted: false };
		expect(() =>
			monteCarlo(
				digitizerDivider,
				{
					tolerances: [{ element: 'Ctop', tolerance: 0.1, distribution: 'uniform' }],
					runs: 1000,
					seed: 1
				},
				{
					signal,
					onProgress: (done) => {
						seen.push(done);
						if (done >= 500) signal.aborted = true;
					}
				}
			)
		).toThrow(/cancelled/);
		expect(seen).toEqual([250, 500]);
	});

	it('names an unknown element', () => {
		expect(() =>
			monteCarlo(divider, {
				tolerances: [{ element: 'R9', tolerance: 0.01, distribution: 'uniform' }],
				runs: 10,
				seed: 1
			})
		).toThrow(/"R9"/);
	});
});

describe('worst case', () => {
	it('corners of a resistive divider bracket the ratio at the closed-form extremes', () => {
		// k is monotonic in each resistor: the extremes are R1 high/R2 low and the reverse (closed form).
		const r = worstCase(divider, {
			method: 'corners',
			tolerances: ['R1', 'R2'].map((element) => ({
				element,
				tolerance: 0.01,
				distribution: 'uniform' as const
			}))
		});
		const g = r.figures.find((f) => f.figure === 'dcGain')!;
		expect(g.min.value!).toBeCloseTo(990 / (990 + 9090), 14);
		expect(g.max.value!).toBeCloseTo(1010 / (1010 + 8910), 14);
		expect(r.evaluations).toBe(5);
	});

	it('the sensitivity-guided search finds the same extremes as all corners on the demo divider', () => {
		const tolerances = ['Rtop', 'Ctop', 'Ccable', 'Radc', 'Cadc'].map((element) => ({
			element,
			tolerance: 0.02,
			distribution: 'uniform' as const
		}));
		const spec = { flatness: { withinDb: 0.2, fLo: 10, fHi: 1e6 } };
		const all = worstCase(digitizerDivider, { method: 'corners', tolerances, spec });
		const quick = worstCase(digitizerDivider, { method: 'sensitivity', tolerances, spec });
		for (const f of ['dcGain', 'bandwidth']) {
			const a = all.figures.find((x) => x.figure === f)!;
			const b = quick.figures.find((x) => x.figure === f)!;
			expect(b.min.value!).toBeCloseTo(a.min.value!, 6);
			expect(b.max.value!).toBeCloseTo(a.max.value!, 6);
		}
		expect(quick.evaluations).toBeLessThan(all.evaluations);
		expect(all.spec!.pass).toBe(false);
		expect(all.spec!.failing.length).toBeGreaterThan(0);
	});

	it('refuses too many corners with advice', () => {
		const tolerances = Array.from({ length: 13 }, (_, i) => ({
			element: `R${(i % 2) + 1}`,
			tolerance: 0.01,
			distribution: 'uniform' as const
		}));
		expect(() => worstCase(divider, { method: 'corners', tolerances })).toThrow(
			/sensitivity-guided/
		);
	});
});

describe('honest statistics (issue 16, item 4)', () => {
	const tolerances = [{ element: 'R1', tolerance: 0.01, distribution: 'uniform' as const }];
	it('no spec limits, no yield: Monte Carlo and worst case give no verdict', () => {
		for (const spec of [undefined, {}]) {
			const r = monteCarlo(divider, { tolerances, runs: 50, seed: 1, spec });
			expect(r.yield).toBeNull();
			const w = worstCase(divider, { method: 'corners', tolerances, spec });
			expect(w.spec).toBeNull();
		}
		// With a limit set there is one.
		const r = monteCarlo(divider, {
			tolerances,
			runs: 50,
			seed: 1,
			spec: { dcGain: { min: 0.09, max: 0.11 } }
		});
		expect(r.yield).toMatchObject({ pass: 50, runs: 50 });
	});

	// A 10:1 compensated divider (9 MΩ ∥ Ct over 1 MΩ ∥ 90 pF, common practice) with Ct ±15 %:
	// over-compensated (Ct ≥ 10 pF) or slightly under, the step jumps past 90 % at once and the
	// 10–90 % rise time is set by the 50 Ω source (sub-ns); under-compensated by more than about
	// 10 % the step jumps to Ct/(Ct + 90 pF) of its input, below 90 % of the final 0.1, and creeps
	// up with τ = (9 MΩ ∥ 1 MΩ)(Ct + 90 pF) ≈ 90 µs — tens of µs. Two populations, decades apart.
	const probe = {
		schema: 1,
		elements: [
			{ id: 'V1', type: 'V', nodes: ['src', 'gnd'], value: 1 },
			{ id: 'Rs', type: 'R', nodes: ['src', 'a'], value: '50' },
			{ id: 'Rt', type: 'R', nodes: ['a', 'b'], value: '9M' },
			{ id: 'Ct', type: 'C', nodes: ['a', 'b'], value: '10p' },
			{ id: 'Rin', type: 'R', nodes: ['b', 'gnd'], value: '1M' },
			{ id: 'Cin', type: 'C', nodes: ['b', 'gnd'], value: '90p' }
		],
		input: 'V1',
		output: { node: 'b' }
	};
	it('a rise time split in two clusters is reported as clusters; the gain as one population', () => {
		const r = monteCarlo(probe, {
			tolerances: [{ element: 'Ct', tolerance: 0.15, distribution: 'uniform' }],
			runs: 400,
			seed: 3
		});
		const rise = r.figures.find((f) => f.figure === 'riseTime')!;
		expect(rise.clusters).toHaveLength(2);
		const [fast, slow] = rise.clusters!;
		expect(fast.max).toBeLessThan(1e-8);
		expect(slow.min).toBeGreaterThan(1e-7);
		expect(slow.max).toBeGreaterThan(1e-5);
		// The mean is typical of neither cluster: hundreds of times the fast one's median, a
		// fraction of the slow one's.
		expect(rise.stats.mean / fast.p50).toBeGreaterThan(100);
		expect(slow.p50 / rise.stats.mean).toBeGreaterThan(3);
		expect(r.figures.find((f) => f.figure === 'dcGain')!.clusters).toBeNull();
	});
});
