import { describe, expect, it } from 'vitest';
import { readSheetFile, writeSheetFile, fileStem, SheetFileError } from './sheet-file';

const doc = {
	output: { reference: 'gnd', node: 'b' },
	input: 'V1',
	elements: [
		{ value: 1, nodes: ['a', 'gnd'], type: 'V', id: 'V1' },
		{ id: 'R1', type: 'R', nodes: ['a', 'b'], value: '9M' },
		{ id: 'C1', type: 'C', nodes: ['b', 0], value: 1e-11 }
	],
	schema: 1
};
const layout = {
	version: 1,
	format: 'polewise-canvas',
	items: [{ y: 40, x: 20, id: 'i1', kind: 'R', name: 'R1', value: '9M', rotation: 0, flip: false }],
	wires: [],
	input: null
};

describe('sheet file', () => {
	it('writes canonically: reading and writing again gives the same bytes', () => {
		const first = writeSheetFile({ name: 'Probe 10:1 — Ω', document: doc, layout });
		const again = writeSheetFile(readSheetFile(first));
		expect(again).toBe(first);
		expect(
			first.startsWith(
				'{\n  "format": "polewise-sheet",\n  "version": 1,\n  "name": "Probe 10:1 — Ω",\n  "document": {\n    "schema": 1,'
			)
		).toBe(true);
		expect(first.endsWith('}\n')).toBe(true);
	});

	it('keeps variants through export and import, byte-stable, in a fixed key order', () => {
		const variants = {
			groups: [
				{
					options: [{ name: 'base' }, { present: ['R1'], values: { R1: '1M', C1: '5p' }, name: 'low' }],
					name: 'Range'
				}
			],
			absent: ['R1']
		};
		const first = writeSheetFile({ name: 'V', document: { ...doc, variants }, layout: null });
		const back = readSheetFile(first);
		expect((back.document as { variants: unknown }).variants).toEqual(variants);
		expect(writeSheetFile(back)).toBe(first);
		// Known keys first (name, values, absent, present), element ids alphabetical.
		expect(first).toMatch(/"name": "low",\n\s+"values": \{\n\s+"C1": "5p",\n\s+"R1": "1M"\n\s+\},\n\s+"present"/);
		expect(first.indexOf('"absent"')).toBeLessThan(first.indexOf('"groups"'));
	});

	it('refuses variants that name a part the sheet does not have', () => {
		const bad = { ...doc, variants: { groups: [{ name: 'G', options: [{ name: 'x', absent: ['Q9'] }] }] } };
		expect(() => readSheetFile(JSON.stringify(bad))).toThrow(
			'variant option "G: x": there is no element "Q9" on the sheet'
		);
	});

	it('imports a bare network document under its title', () => {
		expect(readSheetFile(JSON.stringify({ ...doc, title: 'Bare' })).name).toBe('Bare');
		expect(readSheetFile(JSON.stringify(doc), 'from-file').layout).toBeNull();
	});

	it.each([
		['not JSON', '{"format":', /not valid JSON/],
		['a list', '[]', /expected a JSON object/],
		['another format', '{"format":"other"}', /format is "other"/],
		[
			'a newer version',
			JSON.stringify({ format: 'polewise-sheet', version: 2, name: 'x', document: doc }),
			/version 2 of the sheet format/
		],
		[
			'an empty name',
			JSON.stringify({ format: 'polewise-sheet', version: 1, name: ' ', document: doc }),
			/name is empty/
		],
		[
			'a bad layout',
			JSON.stringify({
				format: 'polewise-sheet',
				version: 1,
				name: 'x',
				document: doc,
				layout: { format: 'x' }
			}),
			/layout.format/
		],
		['neither kind', '{"a":1}', /neither a sheet file/]
	])('refuses %s', (_name, text, message) => {
		expect(() => readSheetFile(text)).toThrow(message);
	});

	it('refuses a bad network with the analyzer’s message and element', () => {
		const bad = {
			...doc,
			elements: [
				...doc.elements.slice(0, 2),
				{ id: 'C1', type: 'C', nodes: ['b', 'gnd'], value: '10pp' }
			]
		};
		try {
			readSheetFile(JSON.stringify(bad));
			expect.unreachable();
		} catch (e) {
			expect(e).toBeInstanceOf(SheetFileError);
			expect((e as SheetFileError).details).toMatchObject({ code: 'bad_value', element: 'C1' });
			expect((e as Error).message).toContain('element "C1"');
		}
	});

	it('makes safe file names', () => {
		expect(fileStem('Probe 10:1 — rev/3')).toBe('Probe-101-rev3');
		expect(fileStem('ΩΩ')).toBe('sheet');
	});
});
