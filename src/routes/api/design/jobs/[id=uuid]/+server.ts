// GET /api/design/jobs/:id — a tolerance run's state, progress and (when done) its result.
import { json } from '@sveltejs/kit';
import { apiActor, endpoint } from '$lib/server/api/respond';
import { jobFor } from '$lib/server/jobs/design-service';

export const GET = endpoint(async (event) =>
	json(
		{ job: await jobFor(apiActor(event), event.params.id!) },
		{ headers: { 'cache-control': 'no-store' } }
	)
);
