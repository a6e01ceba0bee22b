// GET /api/design/sheets/:id/spec?revision=n — pass/fail of a stored revision against the
// sheet's spec limits (the latest revision without ?revision).
import { json } from '@sveltejs/kit';
import { apiActor, endpoint, ApiProblem } from '$lib/server/api/respond';
import { specOfRevision } from '$lib/server/jobs/design-service';

export const GET = endpoint(async (event) => {
	const raw = event.url.searchParams.get('revision');
	const n = raw === null ? undefined : Number(raw);
	if (n !== undefined && !(Number.isInteger(n) && n >= 1))
		throw new ApiProblem(400, 'revision must be a whole number from 1');
	return json(await specOfRevision(apiActor(event), event.params.id!, n));
});
