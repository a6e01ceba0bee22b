import { describe, expect, it } from 'vitest';
import { analyze } from '../solver';
import { digitizerDivider, photodiodeTia, antiAliasFilter } from '../server/db/seed/demo-sheets';
import { evaluateWith, openVariants } from './variants';
import { documentWith } from './prepared';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

// The fast evaluator must reproduce the full analysis (same solver steps, reused structure):
// the reference is the solver's own analyze() of the document with the values written in.
describe('evaluate on a prepared network', () => {
	it.each([
		['divider', digitizerDivider, 'Ctop', 7.3e-12],
		['TIA', photodiodeTia, 'Cf', 2.2e-12],
		['anti-alias', antiAliasFilter, 'R1', 8.2e3]
	] as const)('%s with %s changed matches analyze()', (_name, doc, id, value) => {
		const v = openVariants(doc);
		// Evaluate something else first, so a stale matrix would show.
		evaluateWith(v, { [id]: value * 3 });
		const fast = evaluateWith(v, { [id]: value });
		const full = analyze(documentWith(doc, { [id]: value }));
		expect(fast.poles).toHaveLength(full.poles.length);
		fast.poles.forEach((p, i) =>
			expect(
				Math.hypot(p.re - full.poles[i].re, p.im - full.poles[i].im) / Math.hypot(p.re, p.im)
			).toBeLessThan(1e-9)
		);
		expect(fast.zeros).toHaveLength(full.zeros.length);
		expect(rel(fast.dcGain!, full.dcGain!)).toBeLessThan(1e-9);
		expect(rel(fast.bandwidth!, full.bandwidth!)).toBeLessThan(1e-9);
		if (full.step?.overshoot != null)
			expect(Math.abs(fast.overshoot! - full.step.overshoot)).toBeLessThan(1e-6);
		if (full.step?.riseTime != null)
			expect(rel(fast.riseTime!, full.step.riseTime)).toBeLessThan(1e-6);
	});

	it('a purely resistive divider gives its ratio and input resistance (closed form R2/(R1+R2), R1+R2)', () => {
		const doc = {
			schema: 1,
			elements: [
				{ id: 'V1', type: 'V', nodes: ['in', 'gnd'], value: 1 },
				{ id: 'R1', type: 'R', nodes: ['in', 'out'], value: '9k' },
				{ id: 'R2', type: 'R', nodes: ['out', 'gnd'], value: '1k' }
			],
			input: 'V1',
			output: { node: 'out' }
		};
		const v = openVariants(doc);
		const e = evaluateWith(v, { R2: 3000 }, { inputAt: 0 });
		expect(rel(e.dcGain!, 3000 / 12000)).toBeLessThan(1e-12);
		expect(rel(e.inputResistance!, 12000)).toBeLessThan(1e-12);
		expect(e.poles).toEqual([]);
	});

	it('names the element when it is not adjustable or unknown', () => {
		const v = openVariants(digitizerDivider);
		expect(() => evaluateWith(v, { Vsig: 2 })).toThrow(/no value to adjust/);
		expect(() => evaluateWith(v, { Cx: 2 })).toThrow(/"Cx" is not in the network/);
		expect(() => evaluateWith(v, { Ctop: 0 })).toThrow(/Ctop/);
	});
});
