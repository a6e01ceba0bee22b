// POST /api/sheets/:id/reviews/:requestId/answer { decision: approve | changes, summary? } —
// a reviewer who was asked gives their answer (again, to change it).
import { json } from '@sveltejs/kit';
import { apiActor, endpoint, readBody } from '$lib/server/api/respond';
import { requestContext } from '$lib/server/sharing/context';
import { answerRequest } from '$lib/server/review/review-actions';
import { reviewAnswerBody } from '$lib/server/review/schemas';

export const POST = endpoint(async (event) => {
	const actor = apiActor(event);
	const input = await readBody(event.request, reviewAnswerBody);
	return json({ request: await answerRequest(actor, event.params.id!, event.params.requestId!, input, requestContext(event)) });
});
