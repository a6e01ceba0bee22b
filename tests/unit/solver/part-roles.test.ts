import { describe, expect, test } from 'vitest';
import { networkDocumentSchema } from '../../../src/lib/network/schema';
import { analyze, SolverError, validateNetwork } from '../../../src/lib/solver/index';
import { net, type El } from './helpers';

// Part roles (issue 16): design (default), fixed (parasitic, cable, source — never changed by a
// design aid), trimmer (set within a range). The roles are document fields; the front door keeps
// them and checks a trimmer's range.
const divider = (ct: Record<string, unknown>) =>
	net(
		<El[]>[
			{ id: 'Vin', type: 'V', nodes: ['src', 'gnd'], value: 1 },
			{ id: 'Rt', type: 'R', nodes: ['src', 'b'], value: '9M' },
			{ id: 'Ct', type: 'C', nodes: ['src', 'b'], value: '10p', ...ct },
			{ id: 'Rin', type: 'R', nodes: ['b', 'gnd'], value: '1M' },
			{ id: 'Ccab', type: 'C', nodes: ['b', 'gnd'], value: '90p', role: 'fixed' }
		],
		'b'
	);

const refusal = (doc: unknown) => {
	try {
		validateNetwork(doc);
	} catch (e) {
		return e as SolverError;
	}
	throw new Error('accepted');
};

describe('part roles in the network document', () => {
	test('the schema keeps role and range (zod strips unknown keys, so they must be declared)', () => {
		const doc = networkDocumentSchema.parse(
			divider({ role: 'trimmer', range: { min: '5p', max: '15p' } })
		);
		expect(doc.elements[2]).toMatchObject({ role: 'trimmer', range: { min: '5p', max: '15p' } });
		expect(doc.elements[4].role).toBe('fixed');
	});
	test('an unknown role is refused naming the element', () => {
		const e = refusal(divider({ role: 'variable' }));
		expect(e.element).toBe('Ct');
		expect(e.message).toMatch(/element "Ct": role/);
	});
	test('a trimmer without a range is refused', () => {
		const e = refusal(divider({ role: 'trimmer' }));
		expect(e.code).toBe('bad_value');
		expect(e.message).toBe('element "Ct": a trimmer needs its range (min and max)');
	});
	test('a range written with the wrong unit names the bound', () => {
		const e = refusal(divider({ role: 'trimmer', range: { min: '5pH', max: '15p' } }));
		expect(e.message).toMatch(/^element "Ct": range min: value "5pH"/);
	});
	test('an empty or reversed range is refused', () => {
		const e = refusal(divider({ role: 'trimmer', range: { min: '15p', max: '5p' } }));
		expect(e.message).toBe('element "Ct": the trimmer\'s range min must be below its max');
	});
	test('a trimmer set outside its range is analysed with a warning', () => {
		const a = analyze(divider({ role: 'trimmer', range: { min: '12p', max: '15p' } }), {
			frequency: false,
			step: false
		});
		expect(a.warnings).toContainEqual(
			expect.objectContaining({ code: 'outside_range', element: 'Ct' })
		);
		const inside = analyze(divider({ role: 'trimmer', range: { min: '5p', max: '15p' } }), {
			frequency: false,
			step: false
		});
		expect(inside.warnings.some((w) => w.code === 'outside_range')).toBe(false);
	});
});
