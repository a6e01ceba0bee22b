import { describe, expect, it } from 'vitest';
import { findClusters } from './clusters';
import { mulberry32, normal } from './random';

const sample = (n: number, seed: number, draw: (r: () => number) => number) => {
	const r = mulberry32(seed);
	return Array.from({ length: n }, () => draw(r));
};

describe('findClusters: one population stays one (no false clusters)', () => {
	// 3 shapes × 3 sizes × 20 seeds: normal, uniform, log-normal (σ = 0.3 in ln) — the shapes a
	// tolerance run's figures take when nothing switches.
	const shapes: [string, (r: () => number) => number][] = [
		['normal', (r) => 1e3 * (1 + 0.01 * normal(r))],
		['uniform', (r) => 4.7e-9 * (0.95 + 0.1 * r())],
		['log-normal', (r) => 2e-6 * Math.exp(0.3 * normal(r))],
		['normal around 0', (r) => 1e-3 * normal(r)]
	];
	for (const [name, draw] of shapes)
		for (const n of [100, 1000, 5000])
			it(`${name}, n = ${n}`, () => {
				for (let seed = 1; seed <= 20; seed++)
					expect(findClusters(sample(n, seed, draw))).toBeNull();
			});
	it('a constant figure, and one with round-off only, is one population', () => {
		expect(findClusters(new Array(500).fill(0.1))).toBeNull();
		expect(findClusters(sample(500, 3, (r) => 0.1 * (1 + 1e-15 * r())))).toBeNull();
	});
	it('too few runs to tell', () => expect(findClusters([1, 2, 1e6, 2e6])).toBeNull());
});

describe('findClusters: populations that split are found', () => {
	it('the rise time of the issue: 415 ps and 27 µs, half and half', () => {
		const xs = sample(1000, 7, (r) => (r() < 0.5 ? 415e-12 : 27e-6) * (1 + 0.02 * normal(r)));
		const c = findClusters(xs)!;
		expect(c).toHaveLength(2);
		expect(c[0].p50 / 415e-12).toBeCloseTo(1, 1);
		expect(c[1].p50 / 27e-6).toBeCloseTo(1, 1);
		expect(c[0].fraction + c[1].fraction).toBe(1);
		expect(Math.abs(c[0].fraction - 0.5)).toBeLessThan(0.06);
		// Their mean (what mean ± σ would have said) lies in neither cluster.
		const mean = xs.reduce((a, b) => a + b, 0) / xs.length;
		expect(c.every((k) => mean < k.min || mean > k.max)).toBe(true);
	});
	it('three groups of a signed figure (linear scale), 10 % / 60 % / 30 %', () => {
		const xs = sample(2000, 11, (r) => {
			const u = r();
			return (u < 0.1 ? -2 : u < 0.7 ? 0.5 : 3) + 0.05 * normal(r);
		});
		const c = findClusters(xs)!;
		expect(c.map((k) => Math.round(k.p50 * 10) / 10)).toEqual([-2, 0.5, 3]);
		expect(c.map((k) => Math.round(k.fraction * 10) / 10)).toEqual([0.1, 0.6, 0.3]);
	});
	it('a figure that takes two exact values', () => {
		const xs = sample(400, 5, (r) => (r() < 0.3 ? 1 : 2));
		expect(findClusters(xs)!.map((k) => [k.min, k.max])).toEqual([
			[1, 1],
			[2, 2]
		]);
	});
	it('a handful of stray runs (under 0.5 %) is not a cluster of its own', () => {
		const xs = sample(1000, 9, (r) => 1 + 0.01 * normal(r));
		xs[0] = 50;
		xs[1] = 51;
		expect(findClusters(xs)).toBeNull();
	});
});
