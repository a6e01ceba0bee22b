// GET /api/sheets/:id/compare?from=A&to=B — elements added, removed and changed between two
// revisions, each pole and zero before/after with its movement, and the headline figures.
import { json } from '@sveltejs/kit';
import { apiActor, endpoint } from '$lib/server/api/respond';
import { readQuery } from '$lib/server/api/schemas';
import { compareRevisions } from '$lib/server/review/compare';
import { compareQuery } from '$lib/server/review/schemas';

export const GET = endpoint(async (event) => {
	const { from, to } = readQuery(event.url, compareQuery);
	// Revisions never change, so one comparison stays right; it is private to the caller.
	return json(await compareRevisions(apiActor(event), event.params.id!, from, to), { headers: { 'cache-control': 'private, max-age=300' } });
});
