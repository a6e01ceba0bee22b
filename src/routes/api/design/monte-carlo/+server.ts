// POST /api/design/monte-carlo — queue a tolerance run on a stored revision of a sheet, or on
// the network `document` given (the drawing with unsaved edits), with the sheet's saved
// tolerances and spec limits unless the body gives others. 202 with the job; poll
// GET /api/design/jobs/:id for progress and the result.
import { json } from '@sveltejs/kit';
import { apiActor, BODY_LIMITS, endpoint, readBody } from '$lib/server/api/respond';
import { startMonteCarlo } from '$lib/server/jobs/design-service';
import { monteCarloBody } from '../schema';

export const POST = endpoint(async (event) => {
	const actor = apiActor(event);
	const body = await readBody(event.request, monteCarloBody, BODY_LIMITS.document);
	const job = await startMonteCarlo(actor, body);
	return json({ job }, { status: 202, headers: { location: `/api/design/jobs/${job.id}` } });
});
