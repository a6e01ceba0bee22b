// GET /api/design/sheets/:id/jobs — the sheet's latest tolerance runs (without their results).
import { json } from '@sveltejs/kit';
import { apiActor, endpoint } from '$lib/server/api/respond';
import { jobsOfSheet } from '$lib/server/jobs/design-service';

export const GET = endpoint(async (event) =>
	json(
		{ jobs: await jobsOfSheet(apiActor(event), event.params.id!) },
		{ headers: { 'cache-control': 'no-store' } }
	)
);
