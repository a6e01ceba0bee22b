// GET /api/sheets/:id/measurements/:mid — one measurement with its curve;
// PATCH { name } — rename; DELETE — remove it.
import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiActor, endpoint, readBody } from '$lib/server/api/respond';
import {
	deleteMeasurementAs,
	getMeasurementAs,
	measurementName,
	renameMeasurementAs
} from '$lib/server/exchange/measurement-actions';

const renameBody = z.object({ name: measurementName });

export const GET = endpoint(async (event) =>
	json({
		measurement: await getMeasurementAs(
			apiActor(event),
			event.params.id!,
			event.params.measurementId!
		)
	})
);

export const PATCH = endpoint(async (event) => {
	const actor = apiActor(event);
	const { name } = await readBody(event.request, renameBody);
	return json({
		measurement: await renameMeasurementAs(
			actor,
			event.params.id!,
			event.params.measurementId!,
			name
		)
	});
});

export const DELETE = endpoint(async (event) => {
	await deleteMeasurementAs(apiActor(event), event.params.id!, event.params.measurementId!);
	return new Response(null, { status: 204 });
});
