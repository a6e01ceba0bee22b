import { describe, expect, test } from 'vitest';
import { analyze, SolverError, validateNetwork } from '../../../src/lib/solver/index';
import { el, net } from './helpers';

const ok = [
	el('Vin', 'V', ['in', 'gnd'], 1),
	el('R1', 'R', ['in', 'out'], '1k'),
	el('C1', 'C', ['out', 'gnd'], '1n')
];

/** One row per error code: the document, the code, the element/node it must name, a message fragment. */
const CASES: {
	name: string;
	doc: unknown;
	code: string;
	element?: string;
	node?: string;
	says: string;
}[] = [
	{ name: 'not an object', doc: [1, 2], code: 'bad_document', says: 'JSON object' },
	{ name: 'empty network', doc: net([], 'out'), code: 'empty_network', says: 'no elements' },
	{
		name: 'malformed value',
		doc: net([...ok.slice(0, 2), el('Ct', 'C', ['out', 'gnd'], '10pp')], 'out'),
		code: 'bad_value',
		element: 'Ct',
		says: 'element "Ct": value "10pp" is not a number with an SI prefix'
	},
	{
		name: 'wrong unit for the type',
		doc: net([...ok.slice(0, 2), el('Ct', 'C', ['out', 'gnd'], '10pH')], 'out'),
		code: 'bad_value',
		element: 'Ct',
		says: '"10pH"'
	},
	{
		name: 'missing value',
		doc: net([...ok.slice(0, 2), el('Ct', 'C', ['out', 'gnd'])], 'out'),
		code: 'bad_value',
		element: 'Ct',
		says: 'missing'
	},
	{
		name: 'zero resistor',
		doc: net([ok[0], el('R1', 'R', ['in', 'out'], 0), ok[2]], 'out'),
		code: 'zero_value',
		element: 'R1',
		says: 'value 0'
	},
	{
		name: 'non-finite value',
		doc: net([ok[0], el('R1', 'R', ['in', 'out'], '1e999'), ok[2]], 'out'),
		code: 'non_finite',
		element: 'R1',
		says: 'not finite'
	},
	{
		name: 'duplicate id',
		doc: net([...ok, el('R1', 'R', ['out', 'gnd'], '1k')], 'out'),
		code: 'duplicate_id',
		element: 'R1',
		says: '"R1" is used twice'
	},
	{
		name: 'unknown type',
		doc: net([...ok, el('D1', 'DIODE', ['out', 'gnd'], 1)], 'out'),
		code: 'unknown_type',
		element: 'D1',
		says: 'unknown type "DIODE"'
	},
	{
		name: 'control is not a V element',
		doc: net([...ok, el('F1', 'CCCS', ['out', 'gnd'], 2, 'R1')], 'out'),
		code: 'unknown_control',
		element: 'F1',
		says: '"R1" is not a V element'
	},
	{
		name: 'control missing',
		doc: net([...ok, el('F1', 'CCCS', ['out', 'gnd'], 2)], 'out'),
		code: 'unknown_control',
		element: 'F1',
		says: 'no "control"'
	},
	{
		name: 'input is a resistor',
		doc: net(ok, 'out', 'R1'),
		code: 'bad_input',
		element: 'R1',
		says: 'not a V or I source'
	},
	{
		name: 'input does not exist',
		doc: net(ok, 'out', 'Vx'),
		code: 'bad_input',
		element: 'Vx',
		says: '"Vx"'
	},
	{
		name: 'output node does not exist',
		doc: net(ok, 'nowhere'),
		code: 'unknown_output_node',
		node: 'nowhere',
		says: 'output node "nowhere"'
	},
	{
		name: 'wrong node count',
		doc: net([...ok, el('R2', 'R', ['out', 'gnd', 'in'], 1)], 'out'),
		code: 'bad_nodes',
		element: 'R2',
		says: 'needs 2 nodes'
	},
	{
		name: 'both terminals on one node',
		doc: net([...ok, el('R2', 'R', ['out', 'out'], 1)], 'out'),
		code: 'bad_nodes',
		element: 'R2',
		says: 'both terminals'
	},
	{
		name: 'two V sources in parallel',
		doc: net([...ok, el('V2', 'V', ['in', 'gnd'], 0)], 'out'),
		code: 'source_loop',
		element: 'Vin',
		says: 'loop of voltage sources'
	},
	{
		name: 'inductor across a V source',
		doc: net([...ok, el('L1', 'L', ['in', 'gnd'], '1m')], 'out'),
		code: 'source_loop',
		element: 'Vin',
		says: 'inductors'
	},
	{
		name: 'op-amp output tied to a V source node',
		doc: net([...ok, el('U1', 'OPAMP', ['out', 'gnd', 'in'])], 'out'),
		code: 'source_loop',
		says: 'op-amp'
	},
	{
		name: 'current source into a node with no other way out',
		doc: net([...ok, el('I1', 'I', ['x', 'gnd'], 1), el('R9', 'R', ['x', 'y'], 1)], 'out'),
		code: 'current_cutset',
		element: 'I1',
		says: 'only through current sources'
	},
	{
		name: 'node seen only by an op-amp input',
		doc: net(
			[...ok, el('U1', 'OPAMP', ['p', 'out', 'o2']), el('R5', 'R', ['o2', 'gnd'], 1)],
			'out'
		),
		code: 'singular',
		node: 'p',
		says: 'node "p"'
	}
];

describe('each input error has one precise SolverError', () => {
	for (const c of CASES) {
		test(`${c.name} → ${c.code}`, () => {
			let err: unknown;
			try {
				validateNetwork(c.doc);
			} catch (e) {
				err = e;
			}
			expect(err).toBeInstanceOf(SolverError);
			const se = err as SolverError;
			expect(se.code).toBe(c.code);
			expect(se.message).toContain(c.says);
			if (c.element) expect(se.element).toBe(c.element);
			if (c.node) expect(se.node).toBe(c.node);
			// analyze goes through the same front door
			expect(() => analyze(c.doc)).toThrow(SolverError);
		});
	}
	test('every documented code is exercised by a row above', () => {
		const codes = new Set(CASES.map((c) => c.code));
		for (const code of [
			'empty_network',
			'bad_value',
			'zero_value',
			'non_finite',
			'duplicate_id',
			'unknown_type',
			'unknown_control',
			'bad_input',
			'unknown_output_node',
			'bad_nodes',
			'source_loop',
			'current_cutset',
			'singular',
			'bad_document'
		]) {
			expect(codes.has(code), code).toBe(true);
		}
	});
	test('a negative value is accepted with a warning naming the element; a dangling node is warned', () => {
		const a = analyze(
			net([...ok, el('Rn', 'R', ['out', 'gnd'], '-10k'), el('Rd', 'R', ['out', 'dead'], 1)], 'out')
		);
		expect(a.warnings.find((w) => w.code === 'negative_value')?.element).toBe('Rn');
		expect(a.warnings.find((w) => w.code === 'dangling_node')?.node).toBe('dead');
	});
	test('SolverError serializes to { error, code, element } for JSON bodies', () => {
		const e = new SolverError('bad_value', 'element "X": bad', { element: 'X' });
		expect(JSON.parse(JSON.stringify(e))).toEqual({
			error: 'element "X": bad',
			code: 'bad_value',
			element: 'X'
		});
	});
});

describe('empty and trivial networks', () => {
	test('a purely resistive divider: no poles, no zeros, exact gain, empty time-constant lists', () => {
		const a = analyze(
			net(
				[
					el('Vin', 'V', ['in', 'gnd'], 1),
					el('R1', 'R', ['in', 'out'], '3k'),
					el('R2', 'R', ['out', 0], '1k')
				],
				'out'
			)
		);
		expect(a.poles).toEqual([]);
		expect(a.zeros).toEqual([]);
		expect(a.dcGain).toBeCloseTo(0.25, 14);
		expect(a.timeConstants.openCircuit).toEqual([]);
		expect(a.timeConstants.sequential).toEqual([]);
		expect(a.portMatrices.ports).toEqual([]);
		expect(a.expansion).toBeNull();
		expect(a.meta.reactive).toBe(0);
	});
	test('output not reached by the input: transfer identically zero, warned, not a crash', () => {
		const a = analyze(
			net(
				[
					el('Vin', 'V', ['in', 'gnd'], 1),
					el('R1', 'R', ['in', 'gnd'], 1),
					el('R2', 'R', ['x', 'gnd'], 1),
					el('C2', 'C', ['x', 'gnd'], 1e-9)
				],
				'x'
			)
		);
		expect(a.warnings.some((w) => w.code === 'zero_transfer')).toBe(true);
		expect(a.dcGain).toBe(0);
		expect(a.poles).toHaveLength(1);
	});
});
