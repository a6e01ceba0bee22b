// A measured response from its CSV text and the confirmed columns: frequency in Hz (ascending),
// magnitude in dB and optionally phase in degrees. Every refusal names the row (the file's line
// number) and the column (1-based, with what it was taken to hold).
import { cellNumber, CsvProblem, readTable, type CsvTable } from './csv-table';
import { FREQUENCY_UNITS, guessColumns, type ColumnChoice } from './columns';

export interface MeasuredResponse {
	f: number[];
	magnitudeDb: number[];
	phaseDeg: number[] | null;
}

export type MeasuredResult =
	| { ok: true; data: MeasuredResponse; columns: ColumnChoice; table: CsvTable }
	| { ok: false; error: { message: string; row: number | null; column: number | null } };

export const MIN_POINTS = 2;

function fail(e: unknown): MeasuredResult {
	if (e instanceof CsvProblem)
		return { ok: false, error: { message: e.message, row: e.row, column: e.column } };
	throw e;
}

/** Parse a file; without `choice` the guessed columns are used (the preview shows them). */
export function parseMeasured(text: string, choice?: ColumnChoice): MeasuredResult {
	try {
		const table = readTable(text);
		const columns = choice ?? guessColumns(table);
		return { ok: true, data: extract(table, columns), columns, table };
	} catch (e) {
		return fail(e);
	}
}

const label = { frequency: 'frequency', magnitude: 'magnitude', phase: 'phase' } as const;

export function extract(table: CsvTable, c: ColumnChoice): MeasuredResponse {
	const used = [c.frequency, c.magnitude, ...(c.phase === null ? [] : [c.phase])];
	if (new Set(used).size !== used.length)
		throw new CsvProblem('two roles are given the same column: choose a different column for each');
	const scale = FREQUENCY_UNITS[c.frequencyUnit];
	const points: { f: number; m: number; p: number | null; line: number }[] = [];
	for (const row of table.rows) {
		const read = (col: number, what: keyof typeof label) => {
			const cell = row.cells[col];
			if (cell === undefined || cell === '') {
				throw new CsvProblem(
					`row ${row.line}, column ${col + 1} (${label[what]}): the cell is empty${row.cells.length <= col ? ` (the row has ${row.cells.length} column${row.cells.length === 1 ? '' : 's'})` : ''}`,
					row.line,
					col + 1
				);
			}
			const v = cellNumber(cell, table.decimalComma);
			if (v === null) {
				const hint = table.decimalComma
					? ' (this file uses a decimal comma)'
					: cell.includes(',')
						? ' (this file uses a decimal point)'
						: '';
				throw new CsvProblem(
					`row ${row.line}, column ${col + 1} (${label[what]}): "${cell.slice(0, 40)}" is not a number${hint}`,
					row.line,
					col + 1
				);
			}
			return v;
		};
		const f = read(c.frequency, 'frequency') * scale;
		if (!(f > 0) || !Number.isFinite(f)) {
			throw new CsvProblem(
				`row ${row.line}, column ${c.frequency + 1} (frequency): the frequency must be greater than 0`,
				row.line,
				c.frequency + 1
			);
		}
		let m = read(c.magnitude, 'magnitude');
		if (c.magnitudeKind === 'linear') {
			if (!(m > 0)) {
				throw new CsvProblem(
					`row ${row.line}, column ${c.magnitude + 1} (magnitude): a linear magnitude must be greater than 0 (got ${m}); is this column in dB?`,
					row.line,
					c.magnitude + 1
				);
			}
			m = 20 * Math.log10(m);
		}
		let p = c.phase === null ? null : read(c.phase, 'phase');
		if (p !== null && c.phaseUnit === 'rad') p = (p * 180) / Math.PI;
		points.push({ f, m, p, line: row.line });
	}
	if (points.length < MIN_POINTS)
		throw new CsvProblem(
			`the file has ${points.length} data row${points.length === 1 ? '' : 's'}; at least ${MIN_POINTS} are needed`
		);
	// Sweeps may run either way, but one direction throughout: a step back is a mixed-up file.
	const up = points[1].f > points[0].f;
	for (let i = 1; i < points.length; i++) {
		const a = points[i - 1];
		const b = points[i];
		if (a.f === b.f)
			throw new CsvProblem(
				`row ${b.line}, column ${c.frequency + 1} (frequency): ${b.f} Hz repeats row ${a.line}`,
				b.line,
				c.frequency + 1
			);
		if (b.f > a.f !== up) {
			throw new CsvProblem(
				`row ${b.line}, column ${c.frequency + 1} (frequency): the sweep turns back (${b.f} Hz after ${a.f} Hz); frequencies must rise or fall throughout`,
				b.line,
				c.frequency + 1
			);
		}
	}
	if (!up) points.reverse();
	return {
		f: points.map((x) => x.f),
		magnitudeDb: points.map((x) => x.m),
		phaseDeg: c.phase === null ? null : points.map((x) => x.p!)
	};
}
