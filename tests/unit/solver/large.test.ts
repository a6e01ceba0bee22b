import { describe, expect, test } from 'vitest';
import { analyze, validateNetwork } from '../../../src/lib/solver/index';
import {
	openCircuitPorts,
	shortCircuitFromOpen,
	shortCircuitPorts,
	shortCircuitTimeConstants
} from '../../../src/lib/solver/time-constants';
import { el, net, rel, type El } from './helpers';

/** An RLC ladder long enough (m > 20) for the large-network paths. */
function rlcLadder(sections: number) {
	const els: El[] = [el('Vin', 'V', ['n0', 'gnd'], 1), el('Rs', 'R', ['n0', 'a0'], 50)];
	for (let i = 0; i < sections; i++) {
		els.push(el(`C${i}`, 'C', [`a${i}`, 'gnd'], 1e-9 * (1 + (i % 3))));
		els.push(el(`Rg${i}`, 'R', [`a${i}`, 'gnd'], 1e5));
		// Inductors in series with a resistor, so none sits directly across two shorted capacitors.
		if (i % 4 === 3) {
			els.push(
				el(`L${i}`, 'L', [`a${i}`, `m${i}`], 1e-6 * (1 + (i % 5))),
				el(`Rm${i}`, 'R', [`m${i}`, `a${i + 1}`], 30)
			);
			els.push(el(`Rp${i}`, 'R', [`a${i}`, `a${i + 1}`], 300));
		} else els.push(el(`R${i}`, 'R', [`a${i}`, `a${i + 1}`], 100 * (1 + (i % 7))));
	}
	els.push(el('RL', 'R', [`a${sections}`, 'gnd'], 1e3));
	return net(els, `a${sections}`);
}

describe('large-network paths agree with the direct ones', () => {
	test('short-circuit τ from K = −H⁻¹ equal the direct infinite-value configuration (RLC, m = 80, 1e-9)', () => {
		const nw = validateNetwork(rlcLadder(64));
		const oc = openCircuitPorts(nw);
		expect(oc.m).toBeGreaterThan(60);
		const fast = shortCircuitFromOpen(nw, oc);
		expect(fast).not.toBeNull();
		const a = shortCircuitTimeConstants(nw, fast!);
		const b = shortCircuitTimeConstants(nw, shortCircuitPorts(nw));
		a.forEach((t, i) => {
			expect(t.element).toBe(b[i].element);
			expect(rel(t.tau!, b[i].tau!), t.element).toBeLessThan(1e-9);
		});
	});
	test('an inductor across two shorted capacitors (τ_sc exactly ∞) takes the direct route', () => {
		const doc = rlcLadder(64);
		doc.elements.push(el('Lx', 'L', ['a10', 'a20'], 1e-6));
		const nw = validateNetwork(doc);
		expect(shortCircuitFromOpen(nw, openCircuitPorts(nw))).toBeNull();
		const a = analyze(doc, { frequency: false, step: false });
		expect(a.timeConstants.shortCircuit.find((t) => t.element === 'Lx')!.tau).toBeNull();
	});
	test('Σ open-circuit τ = −Σ 1/p and Σ 1/τ_sc = −Σ p on the same ladder (published identities, 1e-9)', () => {
		const a = analyze(rlcLadder(64), { frequency: false, step: false });
		const b1 = a.timeConstants.openCircuit.reduce((s, t) => s + t.tau!, 0);
		expect(
			rel(-a.poles.reduce((s, p) => s + p.re / (p.re * p.re + p.im * p.im), 0), b1)
		).toBeLessThan(1e-9);
		const sumRate = a.timeConstants.shortCircuit.reduce((s, t) => s + 1 / t.tau!, 0);
		expect(rel(-a.poles.reduce((s, p) => s + p.re, 0), sumRate)).toBeLessThan(1e-9);
	});
});
