// POST /api/design/jobs/:id/cancel — stop a queued or running tolerance run.
import { json } from '@sveltejs/kit';
import { apiActor, endpoint } from '$lib/server/api/respond';
import { cancelJobFor } from '$lib/server/jobs/design-service';

export const POST = endpoint(async (event) =>
	json({ job: await cancelJobFor(apiActor(event), event.params.id!) })
);
