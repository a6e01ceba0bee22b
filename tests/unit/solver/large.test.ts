import { describe, expect, test } from 'vitest';
import { analyze, frequencyResponseAt, validateNetwork } from '../../../src/lib/solver/index';
import {
	openCircuitPorts,
	shortCircuitFromOpen,
	shortCircuitPorts,
	shortCircuitTimeConstants
} from '../../../src/lib/solver/time-constants';
import { shortCircuitTimeConstantsRC } from '../../../src/lib/solver/short-circuit-rc';
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

// Each test analyses a network of 65–100 reactive elements; on a loaded 2-core build machine
// that can pass the default 5 s limit, so these tests allow 30 s.
describe('large-network paths agree with the direct ones', { timeout: 30_000 }, () => {
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

/**
 * A 7×7 resistor grid with a capacitor at every node and 51 more between random node pairs:
 * 100 capacitors, but the loops they form leave only 49 finite poles (the rest are at infinity).
 */
function loopyMesh() {
	let seed = 7;
	const rnd = () => (seed = (seed * 1664525 + 1013904223) >>> 0) / 2 ** 32;
	const side = 7;
	const nodes = side * side;
	const els: El[] = [el('Vin', 'V', ['src', 'gnd'], 1), el('Rs', 'R', ['src', 'm0'], 50)];
	let c = 0;
	for (let i = 0; i < nodes; i++) {
		if (i % side !== side - 1)
			els.push(el(`Rh${i}`, 'R', [`m${i}`, `m${i + 1}`], 100 * 10 ** (2 * rnd())));
		if (i + side < nodes)
			els.push(el(`Rv${i}`, 'R', [`m${i}`, `m${i + side}`], 100 * 10 ** (2 * rnd())));
		els.push(el(`C${c++}`, 'C', [`m${i}`, 'gnd'], 1e-12 * 10 ** (2 * rnd())));
	}
	while (c < 100) {
		const a = Math.floor(rnd() * nodes);
		const b = (a + 1 + Math.floor(rnd() * (nodes - 1))) % nodes;
		els.push(el(`C${c++}`, 'C', [`m${a}`, `m${b}`], 1e-12 * 10 ** (2 * rnd())));
	}
	els.push(el('Rl', 'R', [`m${nodes - 1}`, 'gnd'], 1e4));
	return net(els, `m${nodes - 1}`);
}

describe('zeros of a network with capacitor loops (poles at infinity)', { timeout: 30_000 }, () => {
	test('no more finite zeros than finite poles, and the pole–zero form matches direct solves (1e-9)', () => {
		// Identity: H(s) = K·Π(s − z)/Π(s − p) is the same rational function as the solution of the
		// network equations (G + sC)x = b at every s; the direct solve involves no eigenvalues.
		const doc = loopyMesh();
		const a = analyze(doc, { step: false });
		expect(a.poles.length).toBe(49);
		expect(a.zeros.length).toBeLessThanOrEqual(a.poles.length);
		const fr = a.frequencyResponse!;
		const pick = [0, 40, 80, 120, 160, 199];
		const direct = frequencyResponseAt(
			doc,
			pick.map((i) => fr.f[i])
		);
		pick.forEach((i, k) => {
			const h = direct.h[k];
			const db = 10 * Math.log10(h.re * h.re + h.im * h.im);
			expect(Math.abs(fr.magnitudeDb[i]! - db), `${fr.f[i]} Hz`).toBeLessThan(
				1e-9 * Math.max(1, Math.abs(db))
			);
		});
	});
});

describe('short-circuit τ of RC networks from the Cholesky factor of H', { timeout: 30_000 }, () => {
	/** A random RC network: resistors between neighbours and to ground (values over three
	 *  decades), a capacitor to ground at even nodes and from each odd node to the node before:
	 *  a tree of capacitors (no capacitor loop), so H is dense and positive definite. */
	function rcMesh(nodes: number, seed: number) {
		let s = seed;
		const r = () => ((s = (s * 1664525 + 1013904223) >>> 0), s / 2 ** 32);
		const els: El[] = [el('Vin', 'V', ['src', 'gnd'], 1), el('Rs', 'R', ['src', 'm0'], 50)];
		for (let i = 0; i < nodes; i++) {
			if (i + 1 < nodes) els.push(el(`R${i}`, 'R', [`m${i}`, `m${i + 1}`], 100 * 10 ** (3 * r())));
			if (r() < 0.3) els.push(el(`Rg${i}`, 'R', [`m${i}`, 'gnd'], 1e4 * 10 ** (3 * r())));
			const to = i % 2 === 0 ? 'gnd' : `m${i - 1}`;
			els.push(el(`C${i}`, 'C', [`m${i}`, to], 1e-12 * 10 ** (3 * r())));
		}
		els.push(el('RL', 'R', [`m${nodes - 1}`, 'gnd'], 1e4));
		return net(els, `m${nodes - 1}`);
	}
	test('equal the direct infinite-value configuration on five random meshes (1e-9)', () => {
		for (const seed of [1, 2, 3, 4, 5]) {
			const nw = validateNetwork(rcMesh(30, seed));
			const oc = openCircuitPorts(nw);
			expect(oc.m).toBeGreaterThan(20);
			const fast = shortCircuitTimeConstantsRC(nw, oc);
			expect(fast, `seed ${seed}`).not.toBeNull();
			const direct = shortCircuitTimeConstants(nw, shortCircuitPorts(nw));
			fast!.forEach((t, i) => {
				expect(t.element).toBe(direct[i].element);
				expect(rel(t.tau!, direct[i].tau!), `${t.element}, seed ${seed}`).toBeLessThan(1e-9);
				expect(rel(t.resistance!, direct[i].resistance!)).toBeLessThan(1e-9);
			});
		}
	});
	test('an inductor, a capacitor loop, or a capacitor only it connects: the direct route', () => {
		const withL = rcMesh(30, 9);
		withL.elements.push(el('Lx', 'L', ['m3', 'm4'], 1e-6));
		const a = validateNetwork(withL);
		expect(shortCircuitTimeConstantsRC(a, openCircuitPorts(a))).toBeNull();
		const island = rcMesh(30, 9);
		island.elements.push(el('Cf', 'C', ['m5', 'float'], 1e-12));
		const b = validateNetwork(island);
		expect(shortCircuitTimeConstantsRC(b, openCircuitPorts(b))).toBeNull();
		// C2, C3 and this one close a loop: H is singular, which the pivot check catches.
		const loop = rcMesh(30, 9);
		loop.elements.push(el('Cl', 'C', ['m3', 'gnd'], 1e-12));
		const c = validateNetwork(loop);
		expect(shortCircuitTimeConstantsRC(c, openCircuitPorts(c))).toBeNull();
		expect(analyze(loop, { frequency: false, step: false }).timeConstants.shortCircuit).toHaveLength(
			openCircuitPorts(c).m
		);
	});
});
