import { describe, expect, it } from 'vitest';
import { analyze } from '../solver';
import { antiAliasFilter, digitizerDivider, photodiodeTia } from '../server/db/seed/demo-sheets';
import { documentWith } from './prepared';
import { randomNetwork, seededRandom } from './test-networks';
import { sensitivity } from './sensitivity';

const rcLowPass = {
	schema: 1,
	elements: [
		{ id: 'Vin', type: 'V', nodes: ['in', 'gnd'], value: 1 },
		{ id: 'R', type: 'R', nodes: ['in', 'out'], value: '1k' },
		{ id: 'C', type: 'C', nodes: ['out', 'gnd'], value: '100n' }
	],
	input: 'Vin',
	output: { node: 'out' }
};

type Doc = { elements: { id: string; type: string; value?: unknown }[] };
const valueOf = (doc: Doc, id: string) => doc.elements.find((e) => e.id === id)!.value as number;
const QUICK = { step: false, frequency: false } as const;

/** Central difference of analyze()'s figures in ln x (the full solver, re-run from the document). */
function finiteDifference(
	doc: Doc,
	mids: { re: number; im: number }[],
	id: string,
	x: number,
	h = 1e-5
) {
	const up = analyze(documentWith(doc, { [id]: x * (1 + h) }), QUICK);
	const dn = analyze(documentWith(doc, { [id]: x * (1 - h) }), QUICK);
	return {
		poles: up.poles.map((p, i) => {
			const q = dn.poles[i];
			const mid = mids[i];
			const dr = (p.re - q.re) / (2 * h);
			const di = (p.im - q.im) / (2 * h);
			const d = mid.re * mid.re + mid.im * mid.im;
			return { re: (dr * mid.re + di * mid.im) / d, im: (di * mid.re - dr * mid.im) / d };
		}),
		bandwidth:
			up.bandwidth && dn.bandwidth
				? Math.log(up.bandwidth / dn.bandwidth) / Math.log((1 + h) / (1 - h))
				: null,
		dcGain:
			up.dcGain && dn.dcGain ? Math.log(up.dcGain / dn.dcGain) / Math.log((1 + h) / (1 - h)) : null
	};
}

describe('sensitivity', () => {
	it('RC low-pass: the pole and the bandwidth move as −1 with R and with C; DC gain not at all (closed form p = −1/RC)', () => {
		const s = sensitivity(rcLowPass);
		expect(s.poles).toHaveLength(1);
		for (const id of ['R', 'C']) {
			const e = s.poles[0].entries.find((x) => x.element === id)!;
			expect(e.re).toBeCloseTo(-1, 12);
			expect(e.im).toBeCloseTo(0, 12);
			expect(s.bandwidth.entries.find((x) => x.element === id)!.re).toBeCloseTo(-1, 9);
			expect(s.dcGain.entries.find((x) => x.element === id)!.re).toBeCloseTo(0, 12);
		}
	});

	it('ranks what moves a pole most: the divider’s slow pole belongs to its big resistors and capacitors', () => {
		const s = sensitivity(digitizerDivider);
		const slow = s.poles[0].entries.slice(0, 3).map((e) => e.element);
		expect(slow).not.toContain('Rsrc');
		const fast = s.poles[s.poles.length - 1].entries[0].element;
		// The fast pole is set by the 50 Ω source with the capacitors in series (common practice).
		expect(['Rsrc', 'Ctop']).toContain(fast);
	});

	// Verification against finite differences of the full analysis (not a closed form: the
	// adjoint and perturbation formulas are checked against the solver itself, re-run).
	const cases: [string, Doc][] = [
		['anti-alias (complex poles, op-amp)', antiAliasFilter],
		['TIA (VCCS, VCVS)', photodiodeTia],
		...Array.from(
			{ length: 4 },
			(_, k) =>
				[`random network #${k + 1}`, randomNetwork(seededRandom(100 + k), 4 + k)] as [string, Doc]
		)
	];
	it.each(cases)(
		'%s: pole, bandwidth and DC gain sensitivities agree with finite differences',
		(_name, doc0) => {
			// Values as numbers so the finite differences can scale them.
			const doc = {
				...doc0,
				elements: doc0.elements.map((e) => ({
					...e,
					value: typeof e.value === 'string' ? parseSi(e.value) : e.value
				}))
			};
			const s = sensitivity(doc);
			const full = analyze(doc, QUICK);
			expect(s.poles.length).toBe(full.poles.length);
			for (const id of s.elements) {
				const x = valueOf(doc, id);
				const fd = finiteDifference(doc, full.poles, id, x);
				s.poles.forEach((ps, i) => {
					const e = ps.entries.find((q) => q.element === id)!;
					const scale = Math.max(1e-3, Math.hypot(fd.poles[i].re, fd.poles[i].im));
					expect(
						Math.hypot(e.re - fd.poles[i].re, e.im - fd.poles[i].im) / scale,
						`${id} on pole ${i}`
					).toBeLessThan(1e-4);
				});
				if (fd.dcGain !== null)
					expect(
						Math.abs(s.dcGain.entries.find((q) => q.element === id)!.re - fd.dcGain),
						`${id} on DC gain`
					).toBeLessThan(1e-5);
				if (fd.bandwidth !== null && s.bandwidth.entries.length) {
					expect(
						Math.abs(s.bandwidth.entries.find((q) => q.element === id)!.re - fd.bandwidth),
						`${id} on bandwidth`
					).toBeLessThan(1e-4);
				}
			}
		}
	);
});

function parseSi(v: string): number {
	const m = /^([0-9.eE+-]+)\s*([pnuµmkMG]?)/.exec(v)!;
	const scale: Record<string, number> = {
		'': 1,
		p: 1e-12,
		n: 1e-9,
		u: 1e-6,
		µ: 1e-6,
		m: 1e-3,
		k: 1e3,
		M: 1e6,
		G: 1e9
	};
	return Number(m[1]) * scale[m[2]];
}
