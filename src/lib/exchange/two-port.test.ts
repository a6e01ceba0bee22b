// Two-port S, Z and Y against closed forms. Tolerances are relative; each source is named.
import { describe, expect, it } from 'vitest';
import { twoPort, yFromS, zFromS, defaultPorts, TwoPortError } from './two-port';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);
const p = (plus: string, minus = 'gnd') => ({ plus, minus });

/** A voltage source drives the sheet; the two-port sees only the element between a and b. */
const series = (value: string) => ({
	schema: 1,
	elements: [
		{ id: 'V1', type: 'V', nodes: ['a', 'gnd'], value: 1 },
		{ id: 'X', type: 'R', nodes: ['a', 'b'], value }
	],
	input: 'V1',
	output: { node: 'b' }
});
/** Both ports on the same node pair (b, gnd): the two-port of one shunt element. */
const shuntC = (c: string) => ({
	schema: 1,
	elements: [
		{ id: 'V1', type: 'V', nodes: ['a', 'gnd'], value: 1 },
		{ id: 'R0', type: 'R', nodes: ['a', 'b'], value: '1k' },
		{ id: 'C1', type: 'C', nodes: ['b', 'gnd'], value: c }
	],
	input: 'V1',
	output: { node: 'b' }
});

describe('two-port S-parameters', () => {
	it.each([10, 50, 150, 1e3, 9e6])(
		'series resistor R = %d Ω between 50 Ω ports: S11 = R/(R+100), S21 = 100/(R+100) (closed form)',
		(r) => {
			const t = twoPort({
				document: series(String(r)),
				port1: p('a'),
				port2: p('b'),
				z0: 50,
				frequencies: [1e3, 1e8]
			});
			for (const s of t.s) {
				expect(rel(s[0][0].re, r / (r + 100))).toBeLessThan(1e-9);
				expect(rel(s[1][0].re, 100 / (r + 100))).toBeLessThan(1e-9);
				expect(rel(s[0][1].re, 100 / (r + 100))).toBeLessThan(1e-9);
				expect(rel(s[1][1].re, r / (r + 100))).toBeLessThan(1e-9);
				expect(Math.abs(s[1][0].im)).toBeLessThan(1e-12);
			}
		}
	);

	it('shunt capacitor C across 50 Ω ports: S21 = 1/(1 + jωCZ0/2) (closed form)', () => {
		const c = 1e-9;
		const f = [1e5, 3.18e6, 1e8];
		const t = twoPort({
			document: shuntC('1n'),
			port1: p('b'),
			port2: p('b'),
			z0: 50,
			frequencies: f
		});
		f.forEach((freq, i) => {
			const x = (2 * Math.PI * freq * c * 50) / 2; // S21 = 1/(1 + jx) = (1 − jx)/(1 + x²)
			const s21 = t.s[i][1][0];
			expect(rel(s21.re, 1 / (1 + x * x))).toBeLessThan(1e-6);
			expect(rel(s21.im, -x / (1 + x * x))).toBeLessThan(1e-6);
		});
	});

	it('the default ports are the input source and the output node pair', () => {
		expect(defaultPorts(series('1k'))).toEqual({ port1: p('a'), port2: p('b') });
	});
});

describe('Z and Y from S', () => {
	it('a series element has no Z-parameters; its Y is [[1/R, −1/R], [−1/R, 1/R]] (closed form)', () => {
		const t = twoPort({
			document: series('200'),
			port1: p('a'),
			port2: p('b'),
			z0: 50,
			frequencies: [1e3]
		});
		const z = zFromS(t);
		expect(z.ok).toBe(false);
		if (!z.ok) expect(z.message).toMatch(/Z-parameters do not exist .* at 1000 Hz/);
		const y = yFromS(t);
		expect(y.ok).toBe(true);
		if (y.ok) {
			expect(rel(y.values[0][0][0].re, 1 / 200)).toBeLessThan(1e-9);
			expect(rel(y.values[0][1][0].re, -1 / 200)).toBeLessThan(1e-9);
		}
	});

	it('a shunt element has no Y-parameters; its Z is Zc in every entry (closed form)', () => {
		const t = twoPort({
			document: shuntC('1n'),
			port1: p('b'),
			port2: p('b'),
			z0: 50,
			frequencies: [1e6]
		});
		expect(yFromS(t).ok).toBe(false);
		const z = zFromS(t);
		expect(z.ok).toBe(true);
		if (z.ok) {
			const xc = -1 / (2 * Math.PI * 1e6 * 1e-9);
			expect(rel(z.values[0][0][0].im, xc)).toBeLessThan(1e-6);
			expect(rel(z.values[0][1][0].im, xc)).toBeLessThan(1e-6);
		}
	});
});

describe('refusals', () => {
	it.each([
		[
			'a port node that is not in the network',
			{ port1: p('zz'), port2: p('b') },
			/input port: node "zz" is not a node/
		],
		[
			'both terminals of a port on one node',
			{ port1: p('a', 'a'), port2: p('b') },
			/input port: both terminals are on node "a"/
		]
	])('%s', (_name, ports, message) => {
		expect(() => twoPort({ document: series('1k'), ...ports, z0: 50, frequencies: [1e3] })).toThrow(
			message
		);
	});

	it('a network the analyzer refuses, with the analyzer’s words', () => {
		const bad = series('10pp');
		expect(() =>
			twoPort({ document: bad, port1: p('a'), port2: p('b'), z0: 50, frequencies: [1e3] })
		).toThrow(TwoPortError);
		expect(() =>
			twoPort({ document: bad, port1: p('a'), port2: p('b'), z0: 50, frequencies: [1e3] })
		).toThrow(/element "X"/);
	});
});
