// Exports must not plant spreadsheet formulas (OWASP "CSV Injection": cells starting with
// = + - @, tab or carriage return are evaluated). The three ids are the ones the hostile-client
// probe of issue 14 used; they are valid element ids, so an editor can type them.
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { analyze } from '../solver';
import { metricsCsv } from '../design/table';
import { polesCsv, timeConstantsCsv } from './results-csv';
import { FORMULA_START, guardCell, guardCsvFile } from './formula-guard';

const HOSTILE = ["=cmd|' /C calc'!A0", '-2+3', '\t=1+1', '@SUM(A1)', '+1', '\r=2'];

// A ladder of three RC sections whose resistors and capacitors carry the hostile ids.
const ids = {
	r1: HOSTILE[0],
	c1: HOSTILE[1],
	r2: HOSTILE[2],
	c2: HOSTILE[3],
	r3: HOSTILE[4],
	c3: HOSTILE[5]
};
const network = {
	schema: 1,
	elements: [
		{ id: 'Vin', type: 'V', nodes: ['in', 'gnd'], value: 1 },
		{ id: ids.r1, type: 'R', nodes: ['in', 'a'], value: '1k' },
		{ id: ids.c1, type: 'C', nodes: ['a', 'gnd'], value: '1n' },
		{ id: ids.r2, type: 'R', nodes: ['a', 'b'], value: '10k' },
		{ id: ids.c2, type: 'C', nodes: ['b', 'gnd'], value: '2.2n' },
		{ id: ids.r3, type: 'R', nodes: ['b', 'c'], value: '4.7k' },
		{ id: ids.c3, type: 'C', nodes: ['c', 'gnd'], value: '330p' }
	],
	input: 'Vin',
	output: { node: 'c', reference: 'gnd' }
};

/** Every cell of the file that is not one of our numbers. */
function textCells(csv: string): string[] {
	const { data } = Papa.parse<string[]>(csv.trim(), { newline: '\r\n' });
	return data.flat().filter((c) => c !== '' && !Number.isFinite(Number(c)));
}

describe('CSV exports neutralise formula-like cells', () => {
	const analysis = analyze(network);

	it.each([
		['poles.csv', () => polesCsv(analysis)],
		['time-constants.csv', () => timeConstantsCsv(analysis)]
	])(
		'%s: no text cell starts like a formula, and the ids read back behind one apostrophe',
		(_, make) => {
			const csv = make();
			const cells = textCells(csv);
			expect(cells.length).toBeGreaterThan(0);
			for (const c of cells) expect(c, JSON.stringify(c)).not.toMatch(FORMULA_START);
			// The time-constant table lists each capacitor by id; the pole table names owners.
			const capacitors = [ids.c1, ids.c2, ids.c3];
			for (const id of capacitors)
				expect(cells.some((c) => c === `'${id}` || c.startsWith(`'${id} `))).toBe(true);
		}
	);

	it('leaves numbers alone: negative poles stay numeric cells', () => {
		const { data } = Papa.parse<string[]>(polesCsv(analysis).trim(), { newline: '\r\n' });
		const re = data
			.slice(1)
			.filter((r) => r[0] === 'pole')
			.map((r) => Number(r[2]));
		expect(re).toHaveLength(3);
		for (const v of re) expect(v).toBeLessThan(0);
		expect(re.map((v) => Math.abs(v))).toEqual(analysis.poles.map((p) => Math.abs(p.re)));
	});

	it('guards the design sweep table (element ids head columns, messages fill the last)', () => {
		const csv = metricsCsv(
			[ids.c1, ids.r1],
			[{ values: [1e-9, 1e3], metrics: null, error: '=HYPERLINK("x")' }]
		);
		for (const c of textCells(csv)) expect(c, JSON.stringify(c)).not.toMatch(FORMULA_START);
		expect(textCells(csv)).toContain(`'=HYPERLINK("x")`);
	});

	it('guardCell prefixes only cells that start like a formula', () => {
		expect(guardCell('R1')).toBe('R1');
		expect(guardCell('a=b')).toBe('a=b');
		expect(HOSTILE.map(guardCell)).toEqual(HOSTILE.map((h) => `'${h}`));
	});
});

describe('an uploaded measured-response file handed back for download', () => {
	it('is returned byte for byte when it holds only numbers and plain notes', () => {
		const file = '# sweep 1\r\nf_hz;mag_db;phase_deg\r\n1e3;-0,02;-3,5\r\n1e4;-1,5;+12\r\n';
		expect(guardCsvFile(file)).toBe(file);
	});

	it('guards a header or note cell that starts like a formula, keeping the delimiter and the numbers', () => {
		const file = `freq\t${HOSTILE[0]}\n1000\t-3.2\n`;
		const guarded = guardCsvFile(file);
		const { data } = Papa.parse<string[]>(guarded.trim(), { delimiter: '\t' });
		expect(data).toEqual([
			['freq', `'${HOSTILE[0]}`],
			['1000', '-3.2']
		]);
	});
});
