// Ports of the time-constant view are node pairs: parallel capacitors and series inductors are
// one port each. Each check names its source beside it.
import { describe, expect, test } from 'vitest';
import { analyze } from '../../../src/lib/solver/index';
import { groupReactivePorts } from '../../../src/lib/solver/reactive-ports';
import { validateNetwork } from '../../../src/lib/solver/validate';
import { el, expectRel, net, probe10x, worstRootError } from './helpers';

const probe = (cable: 'one' | 'split') =>
	cable === 'one'
		? probe10x()
		: probe10x([el('Cscope', 'C', ['b', 'gnd'], '20p'), el('Ccable', 'C', ['gnd', 'b'], '70p')]);

describe('parallel capacitors are one port (common practice: capacitances in parallel add)', () => {
	const one = analyze(probe('one'));
	const split = analyze(probe('split'));
	const byId = (a: typeof one, kind: 'openCircuit' | 'shortCircuit') =>
		Object.fromEntries(a.timeConstants[kind].map((t) => [t.element, t]));

	test('the 10:1 probe with its 90 pF split into 20 pF + 70 pF (one reversed) gives the port τ of one 90 pF capacitor (1e-12)', () => {
		const o = byId(one, 'openCircuit');
		const s = byId(split, 'openCircuit');
		expect(Object.keys(s)).toEqual(['Ct', 'Cscope + Ccable']);
		expect(s['Cscope + Ccable'].members).toEqual(['Cscope', 'Ccable']);
		expectRel(s['Cscope + Ccable'].value, 90e-12, 1e-12, 'total C');
		expectRel(s['Cscope + Ccable'].tau, o.Cin.tau!, 1e-12, 'open τ');
		expectRel(s['Cscope + Ccable'].resistance, o.Cin.resistance!, 1e-12, 'open R');
		expectRel(s.Ct.tau, o.Ct.tau!, 1e-12, 'Ct open τ');
		const so = byId(one, 'shortCircuit');
		const ss = byId(split, 'shortCircuit');
		// Shorted, the pair is one short: no "R = 0, τ = 0" for either part.
		expectRel(ss['Cscope + Ccable'].tau, so.Cin.tau!, 1e-12, 'short τ');
	});

	test('sequential steps, port matrices and the headline estimates are those of the single capacitor', () => {
		expect(split.timeConstants.sequential.map((s) => s.element)).toEqual(['Cscope + Ccable', 'Ct']);
		one.timeConstants.sequential.forEach((s, i) =>
			expectRel(split.timeConstants.sequential[i].tau, s.tau!, 1e-12, `step ${i + 1}`)
		);
		expect(split.portMatrices.ports).toEqual(['Ct', 'Cscope + Ccable']);
		expect(split.portMatrices.members).toEqual([['Ct'], ['Cscope', 'Ccable']]);
		expectRel(split.portMatrices.C[1][1], 90e-12, 1e-12, 'C of the port');
		one.portMatrices.R.flat().forEach((r, i) =>
			expectRel(split.portMatrices.R.flat()[i], r!, 1e-12, `R entry ${i}`)
		);
		one.poles.forEach((p, i) => {
			expect(split.poles[i].estimate!.method).toBe(p.estimate!.method);
			expectRel(split.poles[i].estimate!.hz, p.estimate!.hz, 1e-12, `estimate ${i + 1}`);
		});
	});

	test('the exact poles are unchanged and ownership stays per element (shares split by capacitance)', () => {
		expect(worstRootError(split.poles, one.poles)).toBeLessThan(1e-12);
		const slow = Object.fromEntries(split.poles[0].owners.map((o) => [o.element, o.share]));
		const cin = one.poles[0].owners.find((o) => o.element === 'Cin')!.share;
		// Participation of parallel parts is in proportion to their charge, i.e. to C (common practice).
		expectRel(slow.Cscope, (cin * 20) / 90, 1e-6, 'Cscope share');
		expectRel(slow.Ccable, (cin * 70) / 90, 1e-6, 'Ccable share');
	});

	test('a lone capacitor is its own port (name = id, members = [id])', () => {
		expect(one.timeConstants.openCircuit.map((t) => [t.element, t.members])).toEqual([
			['Ct', ['Ct']],
			['Cin', ['Cin']]
		]);
	});
});

describe('series inductors in one branch are one port (common practice: inductances in series add)', () => {
	const lc = (split: boolean) =>
		net(
			[
				el('Vin', 'V', ['in', 'gnd'], 1),
				el('Rs', 'R', ['in', 'a'], '50'),
				...(split
					? [el('L1', 'L', ['a', 'm'], '3u'), el('L2', 'L', ['b', 'm'], '7u')]
					: [el('L', 'L', ['a', 'b'], '10u')]),
				el('C', 'C', ['b', 'gnd'], '1n'),
				el('Rl', 'R', ['b', 'gnd'], '50')
			],
			'b'
		);
	const one = analyze(lc(false));
	const two = analyze(lc(true));
	test('L1 + L2 = 10 µH reads as one 10 µH inductor in every view (1e-12)', () => {
		const port = two.timeConstants.openCircuit.find((t) => t.element === 'L1 + L2')!;
		expect(port.members).toEqual(['L1', 'L2']);
		expectRel(port.value, 10e-6, 1e-12, 'total L');
		const ref = one.timeConstants.openCircuit.find((t) => t.element === 'L')!;
		expectRel(port.tau, ref.tau!, 1e-12, 'open τ');
		const sref = one.timeConstants.shortCircuit.find((t) => t.element === 'L')!;
		const sport = two.timeConstants.shortCircuit.find((t) => t.element === 'L1 + L2')!;
		expectRel(sport.tau, sref.tau!, 1e-12, 'short τ');
		expect(worstRootError(two.poles, one.poles)).toBeLessThan(1e-10);
	});
	test('a node the output observes is not folded away', () => {
		const doc = { ...lc(true), output: { node: 'm' } };
		const { ports } = groupReactivePorts(validateNetwork(doc));
		expect(ports.map((p) => p.id)).toEqual(['L1', 'L2', 'C']);
	});
	test('a node a controlled source senses is not folded away', () => {
		const doc = lc(true);
		doc.elements.push(el('G', 'VCCS', ['b', 'gnd', 'm', 'gnd'], '1m'));
		const { ports } = groupReactivePorts(validateNetwork(doc));
		expect(ports.map((p) => p.id)).toEqual(['L1', 'L2', 'C']);
	});
});

describe('grouping leaves the rest of the network as it is', () => {
	test('controls are re-indexed: a CCCS sensing a V after a folded capacitor still sees it', () => {
		const doc = net(
			[
				el('Vin', 'V', ['in', 'gnd'], 1),
				el('C1', 'C', ['in', 'x'], '1n'),
				el('C2', 'C', ['x', 'in'], '1n'),
				el('Vs', 'V', ['x', 'y'], 0),
				el('R1', 'R', ['y', 'gnd'], '1k'),
				el('F', 'CCCS', ['out', 'gnd'], 2, 'Vs'),
				el('R2', 'R', ['out', 'gnd'], '1k')
			],
			'out'
		);
		const resolved = validateNetwork(doc);
		const { net: grouped, ports } = groupReactivePorts(resolved);
		expect(ports.map((p) => p.id)).toEqual(['C1 + C2']);
		const f = grouped.elements.find((e) => e.id === 'F')!;
		expect(grouped.elements[f.control].id).toBe('Vs');
		expect(grouped.elements[grouped.input].id).toBe('Vin');
		// τ = (C1 + C2)·R1 = 2 µs (closed form); the single pole at −1/τ.
		const a = analyze(doc);
		expectRel(a.timeConstants.openCircuit[0].tau, 2e-6, 1e-12, 'port τ');
		expectRel(a.poles[0].re, -1 / 2e-6, 1e-10, 'pole');
	});
	test('capacitors whose values cancel stay two ports (no zero-valued port is made)', () => {
		const doc = net(
			[
				el('Vin', 'V', ['in', 'gnd'], 1),
				el('R', 'R', ['in', 'x'], '1k'),
				el('Cp', 'C', ['x', 'gnd'], '1n'),
				el('Cn', 'C', ['x', 'gnd'], '-1n'),
				el('C2', 'C', ['in', 'x'], '1n')
			],
			'x'
		);
		const { ports } = groupReactivePorts(validateNetwork(doc));
		expect(ports.map((p) => p.id)).toEqual(['Cp', 'Cn', 'C2']);
	});
});
