import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, test } from 'vitest';
import { analyze } from '../../../src/lib/solver/index';
import { expectRel, worstRootError } from './helpers';

/**
 * Pinned regression fixtures: the example networks in docs/examples, analysed once and frozen in
 * tests/unit/solver/fixtures (values the solver produced after passing the closed-form tests
 * above). A change in any pinned figure beyond 1e-9 relative is a behaviour change to explain.
 */
const dir = 'tests/unit/solver/fixtures';
type Pin = {
	source: string;
	poles: { re: number; im: number; owner: string | null }[];
	zeros: { re: number; im: number }[];
	dcGain: number | null;
	openCircuit: [string, number | null][];
	shortCircuit: [string, number | null][];
	sequential: [string, number | null][];
	b: number[];
	magnitudeDb: (number | null)[];
};

describe('pinned regression fixtures (tolerance 1e-9 relative)', () => {
	const files = readdirSync(dir).filter((f) => f.endsWith('.json'));
	test('there is a fixture for every example network', () => {
		expect(files.sort()).toEqual(
			readdirSync('docs/examples')
				.filter((f) => f.endsWith('.json'))
				.sort()
		);
	});
	for (const f of files) {
		test(f, () => {
			const pin: Pin = JSON.parse(readFileSync(`${dir}/${f}`, 'utf8'));
			const a = analyze(JSON.parse(readFileSync(pin.source, 'utf8')), {
				frequency: { points: 5 },
				step: false
			});
			expect(worstRootError(a.poles, pin.poles)).toBeLessThan(1e-9);
			expect(a.poles.map((p) => p.owners[0]?.element ?? null)).toEqual(
				pin.poles.map((p) => p.owner)
			);
			if (pin.zeros.length) expect(worstRootError(a.zeros, pin.zeros)).toBeLessThan(1e-9);
			else expect(a.zeros).toEqual([]);
			if (pin.dcGain === null) expect(a.dcGain).toBeNull();
			else expectRel(a.dcGain, pin.dcGain, 1e-9, 'DC gain');
			const cmp = (
				got: { element: string; tau: number | null }[],
				want: [string, number | null][],
				what: string
			) => {
				expect(got.map((t) => t.element)).toEqual(want.map((w) => w[0]));
				got.forEach((t, i) => {
					if (want[i][1] === null || want[i][1] === 0) expect(t.tau).toBe(want[i][1]);
					else expectRel(t.tau, want[i][1] as number, 1e-9, `${what} ${t.element}`);
				});
			};
			cmp(a.timeConstants.openCircuit, pin.openCircuit, 'τ_oc');
			cmp(a.timeConstants.shortCircuit, pin.shortCircuit, 'τ_sc');
			cmp(a.timeConstants.sequential, pin.sequential, 'sequential');
			(a.expansion?.denominator ?? []).forEach((c, i) =>
				expectRel(c.value, pin.b[i], 1e-9, `b${i + 1}`)
			);
			a.frequencyResponse!.magnitudeDb.forEach((m, i) =>
				expect(Math.abs((m as number) - (pin.magnitudeDb[i] as number))).toBeLessThan(1e-7)
			);
		});
	}
});
