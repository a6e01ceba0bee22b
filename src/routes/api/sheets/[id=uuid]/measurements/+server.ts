// GET /api/sheets/:id/measurements — the sheet's measured responses (?curves=1 adds each curve);
// POST (multipart: file, optional name and columns JSON) — parse and store one; 413 over the
// upload limit, 415 for a file that is not text, 422 naming the row and column of a bad cell.
import { json } from '@sveltejs/kit';
import { apiActor, endpoint } from '$lib/server/api/respond';
import { listMeasurementsAs, uploadMeasurementAs } from '$lib/server/exchange/measurement-actions';
import { readUpload } from '$lib/server/exchange/upload';

export const GET = endpoint(async (event) => {
	const curves = ['1', 'true'].includes(event.url.searchParams.get('curves') ?? '');
	return json({
		measurements: await listMeasurementsAs(apiActor(event), event.params.id!, curves)
	});
});

export const POST = endpoint(async (event) => {
	const actor = apiActor(event);
	const upload = await readUpload(event.request, event.url);
	return json(
		{ measurement: await uploadMeasurementAs(actor, event.params.id!, upload) },
		{ status: 201 }
	);
});
