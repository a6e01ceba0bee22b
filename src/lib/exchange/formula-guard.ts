// Spreadsheet formula injection (OWASP "CSV Injection"): a spreadsheet that opens a CSV runs a
// cell starting with = + - @ as a formula, and strips a leading tab or carriage return before
// deciding. Element ids, names and messages are typed by people, so every text cell we write
// that starts with one of those characters gets a leading apostrophe, which spreadsheets show
// as text and do not evaluate; the writer then quotes it (OWASP's advice: prefix and quote).
// Numbers we format ourselves (a negative pole is "-6283.18…") are left alone: they are numbers.
import Papa from 'papaparse';
import { chooseDelimiter } from './csv-table';

/** The characters OWASP lists as starting a formula. */
export const FORMULA_START = /^[=+\-@\t\r]/;

/** A text cell safe to open in a spreadsheet: unchanged unless it could start a formula. */
export function guardCell(text: string): string {
	return FORMULA_START.test(text) ? `'${text}` : text;
}

/** A cell that reads as a plain number ("-3.2", "+1e-9", "-0,5") is data, not a formula. */
const PLAIN_NUMBER = /^[+-]?(\d+([.,]\d*)?|[.,]\d+)([eE][+-]?\d+)?$/;
const risky = (cell: string) => FORMULA_START.test(cell) && !PLAIN_NUMBER.test(cell.trim());

/**
 * A whole CSV/TSV file handed back for download (an uploaded measured response): returned
 * byte for byte when no text cell starts like a formula — the normal case, data rows are
 * numbers — and otherwise re-written with those cells guarded and quoted, delimiter kept.
 */
export function guardCsvFile(text: string): string {
	// The delimiter the upload reader chose (papaparse's own guess can take a "|" inside a cell).
	const body = text.replace(/^\uFEFF/, '');
	const delimiter = chooseDelimiter(body.split(/\r?\n/));
	const { data } = Papa.parse<string[]>(body, { delimiter });
	if (!data.some((row) => row.some(risky))) return text;
	const newline = text.includes('\r\n') ? '\r\n' : '\n';
	const rows = data.map((row) => row.map((c) => (risky(c) ? `'${c}` : c)));
	return `${Papa.unparse(rows, { delimiter, newline, escapeFormulae: false })}${newline}`;
}
