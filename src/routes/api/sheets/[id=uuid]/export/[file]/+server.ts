// GET /api/sheets/:id/export/{poles,time-constants,response,step}.csv[?revision=n] — a results
// table of the revision's analysis as CSV (422 when the solver refuses the network).
import { apiActor, endpoint, ApiProblem } from '$lib/server/api/respond';
import { fileStem, RESULT_TABLES, resultsCsv, type ResultTable } from '$lib/exchange';
import { fileResponse } from '$lib/server/exchange/serve';
import { revisionAnalysis, revisionFromQuery } from '$lib/server/exchange/stored-results';

export const GET = endpoint(async (event) => {
	const table = event.params.file!.replace(/\.csv$/, '') as ResultTable;
	if (!event.params.file!.endsWith('.csv') || !RESULT_TABLES.includes(table))
		throw new ApiProblem(
			404,
			`No such export; try ${RESULT_TABLES.map((t) => `${t}.csv`).join(', ')}.`
		);
	const { sheet, revision } = await revisionFromQuery(
		apiActor(event),
		event.params.id!,
		event.url,
		'analyze'
	);
	const analysis = await revisionAnalysis(revision.document, revision.number);
	return fileResponse(
		resultsCsv(analysis, table),
		'text/csv; charset=utf-8',
		`${fileStem(sheet.name)}-r${revision.number}-${table}.csv`
	);
});
