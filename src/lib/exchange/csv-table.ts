// A measured-response file read into rows of text cells, each with the line it came from, so
// every later message can name the exact row. Delimiter and decimal mark are decided here once
// (papaparse's own guess cannot tell "1,5;2,5" with decimal commas from a comma file).
import Papa from 'papaparse';

export type Delimiter = ',' | ';' | '\t';

export interface CsvRow {
	/** 1-based line number in the file (the header and blank lines count). */
	line: number;
	cells: string[];
}

export interface CsvTable {
	delimiter: Delimiter;
	decimalComma: boolean;
	/** The header cells when the first row is not all numbers, else null. */
	header: string[] | null;
	headerLine: number | null;
	rows: CsvRow[];
	/** Widest data row. */
	columns: number;
}

export class CsvProblem extends Error {
	constructor(
		message: string,
		readonly row: number | null = null,
		readonly column: number | null = null
	) {
		super(message);
		this.name = 'CsvProblem';
	}
}

/** Lines starting with these are instrument notes, not data ("!" and "#" are common exports). */
const COMMENT = /^\s*[#!%]/;
const NUMBER = /^[+-]?(\d+([.,]\d*)?|[.,]\d+)([eE][+-]?\d+)?$/;

export const MAX_ROWS = 200_000;

export function chooseDelimiter(lines: string[]): Delimiter {
	const sample = lines.filter((l) => l.trim() && !COMMENT.test(l)).slice(0, 20);
	if (sample.some((l) => l.includes('\t'))) return '\t';
	if (sample.some((l) => l.includes(';'))) return ';';
	return ',';
}

/** A cell as a number under the file's decimal mark, or null when it is not a plain number. */
export function cellNumber(cell: string, decimalComma: boolean): number | null {
	const t = cell.trim();
	if (!NUMBER.test(t)) return null;
	if (!decimalComma && t.includes(',')) return null;
	if (decimalComma && t.includes('.')) return null;
	const v = Number(decimalComma ? t.replace(',', '.') : t);
	return Number.isFinite(v) ? v : null;
}

export function readTable(input: string): CsvTable {
	const text = input.replace(/^\uFEFF/, '').replace(/\r\n?/g, '\n');
	if (!text.trim()) throw new CsvProblem('the file is empty');
	const delimiter = chooseDelimiter(text.split('\n'));
	const raw: CsvRow[] = [];
	let start = 0;
	let line = 1;
	Papa.parse<string[]>(text, {
		delimiter,
		newline: '\n',
		step: (result) => {
			const end = result.meta.cursor;
			const cells = result.data.map((c) => c.trim());
			const blank = cells.every((c) => c === '');
			if (!blank && !COMMENT.test(cells[0] ?? ''))
				raw.push({ line, cells: trimTrailingEmpty(cells) });
			for (let i = start; i < end; i++) if (text.charCodeAt(i) === 10) line++;
			start = end;
		}
	});
	if (raw.length === 0)
		throw new CsvProblem('the file has no data rows (only blank or comment lines)');
	if (raw.length > MAX_ROWS + 1) throw new CsvProblem(`the file has more than ${MAX_ROWS} rows`);
	// A decimal comma is only possible when the comma is not the delimiter; the mark most cells
	// use wins, so a stray "2.5" in a decimal-comma file is reported on its own row.
	const count = (re: RegExp) =>
		raw.reduce((n, r) => n + r.cells.filter((c) => re.test(c)).length, 0);
	const decimalComma =
		delimiter !== ',' &&
		count(/^[+-]?\d*,\d+([eE][+-]?\d+)?$/) > count(/^[+-]?\d*\.\d+([eE][+-]?\d+)?$/);
	const first = raw[0];
	const isHeader = first.cells.some((c) => cellNumber(c, decimalComma) === null);
	const rows = isHeader ? raw.slice(1) : raw;
	return {
		delimiter,
		decimalComma,
		header: isHeader ? first.cells : null,
		headerLine: isHeader ? first.line : null,
		rows,
		columns: Math.max(0, ...rows.map((r) => r.cells.length))
	};
}

function trimTrailingEmpty(cells: string[]): string[] {
	let n = cells.length;
	while (n > 1 && cells[n - 1] === '') n--;
	return cells.slice(0, n);
}
