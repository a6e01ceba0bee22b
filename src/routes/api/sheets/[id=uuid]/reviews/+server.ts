// GET /api/sheets/:id/reviews — the review state and every request with its answers;
// POST { reviewers, message?, dueOn?, revision? } — ask people to review a revision.
import { json } from '@sveltejs/kit';
import { apiActor, endpoint, readBody } from '$lib/server/api/respond';
import { requestContext } from '$lib/server/sharing/context';
import { requestReview, reviewOverview } from '$lib/server/review/review-actions';
import { reviewRequestBody } from '$lib/server/review/schemas';

export const GET = endpoint(async (event) => json(await reviewOverview(apiActor(event), event.params.id!), { headers: { 'cache-control': 'no-store' } }));

export const POST = endpoint(async (event) => {
	const actor = apiActor(event);
	const input = await readBody(event.request, reviewRequestBody);
	return json({ request: await requestReview(actor, event.params.id!, input, requestContext(event)) }, { status: 201 });
});
