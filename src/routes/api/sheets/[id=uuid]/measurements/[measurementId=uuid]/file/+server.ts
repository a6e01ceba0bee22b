// GET /api/sheets/:id/measurements/:mid/file — the CSV exactly as it was uploaded (a download).
import { apiActor, endpoint } from '$lib/server/api/respond';
import { measurementFileAs } from '$lib/server/exchange/measurement-actions';
import { fileResponse } from '$lib/server/exchange/serve';

export const GET = endpoint(async (event) => {
	const { fileName, source } = await measurementFileAs(
		apiActor(event),
		event.params.id!,
		event.params.measurementId!
	);
	return fileResponse(source, 'text/csv; charset=utf-8', fileName);
});
