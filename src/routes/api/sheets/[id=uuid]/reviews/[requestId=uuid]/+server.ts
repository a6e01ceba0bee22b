// DELETE /api/sheets/:id/reviews/:requestId — withdraw a review request (people who may save).
import { apiActor, endpoint } from '$lib/server/api/respond';
import { withdrawRequest } from '$lib/server/review/review-actions';

export const DELETE = endpoint(async (event) => {
	await withdrawRequest(apiActor(event), event.params.id!, event.params.requestId!);
	return new Response(null, { status: 204 });
});
