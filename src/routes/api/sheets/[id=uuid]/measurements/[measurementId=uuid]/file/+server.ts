// GET /api/sheets/:id/measurements/:mid/file — the CSV as it was uploaded (a download): byte for
// byte, unless a text cell starts like a spreadsheet formula, which is guarded (formula-guard.ts).
import { apiActor, endpoint } from '$lib/server/api/respond';
import { guardCsvFile } from '$lib/exchange/formula-guard';
import { measurementFileAs } from '$lib/server/exchange/measurement-actions';
import { fileResponse } from '$lib/server/exchange/serve';

export const GET = endpoint(async (event) => {
	const { fileName, source } = await measurementFileAs(
		apiActor(event),
		event.params.id!,
		event.params.measurementId!
	);
	const text = source.toString('utf8');
	const guarded = guardCsvFile(text);
	return fileResponse(guarded === text ? source : guarded, 'text/csv; charset=utf-8', fileName);
});
