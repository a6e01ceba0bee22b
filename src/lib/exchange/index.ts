/** Data in and out: measured responses, sheet files, results CSV, Touchstone. Pure TypeScript. */
export { readTable, CsvProblem, type CsvTable, type CsvRow } from './csv-table';
export {
	guessColumns,
	columnChoiceSchema,
	FREQUENCY_UNITS,
	type ColumnChoice,
	type ColumnGuess,
	type FrequencyUnit
} from './columns';
export { parseMeasured, extract, type MeasuredResponse, type MeasuredResult } from './measured';
export { deviation, modelDbAt, type Deviation, type Curve } from './deviation';
export {
	readSheetFile,
	writeSheetFile,
	fileStem,
	SheetFileError,
	SHEET_FILE_FORMAT,
	SHEET_FILE_MAX_BYTES,
	LARGE_SHEET_FILE_MAX_BYTES,
	type SheetFileContent
} from './sheet-file';
export { resultsCsv, RESULT_TABLES, type ResultTable } from './results-csv';
export {
	twoPort,
	zFromS,
	yFromS,
	defaultPorts,
	portNodes,
	TwoPortError,
	type PortPair,
	type TwoPortResult
} from './two-port';
export {
	writeTouchstone,
	frequencyList,
	asciiComment,
	TOUCHSTONE_VERSIONS,
	type TouchstoneParameter,
	type TouchstoneFormat,
	type TouchstoneVersion
} from './touchstone';
