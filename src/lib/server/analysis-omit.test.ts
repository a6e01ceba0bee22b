import { describe, expect, it } from 'vitest';
import { analyze } from '../solver';
import { demoSheets } from './db/seed/demo-sheets';
import { readTrim, skipped, trimAnalysis } from './analysis-omit';
import { ApiProblem } from './api/respond';

const divider = demoSheets[0].document;
const full = analyze(divider, { frequency: { points: 50 }, step: { points: 50 } });
const url = (q: string) => new URL(`http://x/api/analyze?${q}`);

describe('analysis response trimming', () => {
	it('without options the answer is the whole analysis, unchanged', () => {
		expect(trimAnalysis(full, readTrim(url('points=50')))).toEqual(full);
	});

	it('omits only what is named, keeping every key and the figures the panels draw', () => {
		const t = trimAnalysis(full, readTrim(url('omit=impedanceCurve,groupDelay,expansion')));
		expect(t.inputImpedance).toEqual({
			dc: full.inputImpedance!.dc,
			f: [],
			magnitude: [],
			phaseDeg: []
		});
		expect(t.frequencyResponse!.groupDelay).toEqual([]);
		expect(t.frequencyResponse!.magnitudeDb).toEqual(full.frequencyResponse!.magnitudeDb);
		expect(t.expansion).toBeNull();
		expect(t.poles).toEqual(full.poles);
		expect(t.step).toEqual(full.step);
		// Measured beside the step, whose size depends on the poles (log-spaced samples when they
		// span more than two decades), not on what is omitted.
		const size = (a: typeof full) => JSON.stringify({ ...a, step: null }).length;
		expect(size(t)).toBeLessThan(size(full) * 0.75);
		// The analysis itself is not touched (the worker's copy may be reused).
		expect(full.frequencyResponse!.groupDelay.length).toBe(50);
	});

	it('drops the port matrices above matrixPorts ports, keeps the port list', () => {
		const ports = full.portMatrices.ports.length;
		expect(ports).toBeGreaterThan(1);
		const small = trimAnalysis(full, readTrim(url(`matrixPorts=${ports}`)));
		expect(small.portMatrices).toEqual(full.portMatrices);
		const cut = trimAnalysis(full, readTrim(url(`matrixPorts=${ports - 1}`)));
		expect(cut.portMatrices).toEqual({ ...full.portMatrices, R: [], C: [] });
	});

	it('refuses unknown parts and bad port counts with a 400 naming the option', () => {
		for (const [q, word] of [
			['omit=poles', 'omit'],
			['matrixPorts=two', 'matrixPorts'],
			['matrixPorts=-1', 'matrixPorts']
		]) {
			const e = (() => {
				try {
					readTrim(url(q));
				} catch (error) {
					return error;
				}
			})();
			expect(e).toBeInstanceOf(ApiProblem);
			expect((e as ApiProblem).status).toBe(400);
			expect((e as ApiProblem).message).toContain(word);
		}
	});

	it('what is omitted is not computed: the solver skips it and the answer is the same', () => {
		const trim = readTrim(url('omit=impedanceCurve,groupDelay,expansion'));
		expect(skipped(trim)).toEqual({ expansion: false, impedanceCurve: false });
		expect(skipped(readTrim(url('omit=groupDelay')))).toEqual({});
		const lean = analyze(divider, {
			frequency: { points: 50 },
			step: { points: 50 },
			...skipped(trim)
		});
		expect(lean.expansion).toBeNull();
		expect(lean.inputImpedance).toEqual({
			dc: full.inputImpedance!.dc,
			f: [],
			magnitude: [],
			phaseDeg: []
		});
		const { meta: _a, ...leanRest } = trimAnalysis(lean, trim);
		const { meta: _b, ...fullRest } = trimAnalysis(full, trim);
		expect(leanRest).toEqual(fullRest);
	});
});
