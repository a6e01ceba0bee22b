// PATCH /api/meetings/:id/items/:itemId { outcome?, notes? } — record what the meeting decided;
// DELETE — take the item off the agenda.
import { json } from '@sveltejs/kit';
import { apiActor, endpoint, readBody } from '$lib/server/api/respond';
import { dropItem, recordOutcome } from '$lib/server/review/meeting-actions';
import { meetingOutcomeBody } from '$lib/server/review/schemas';

export const PATCH = endpoint(async (event) => {
	const actor = apiActor(event);
	const input = await readBody(event.request, meetingOutcomeBody);
	return json({ item: await recordOutcome(actor, event.params.id!, event.params.itemId!, input) });
});

export const DELETE = endpoint(async (event) => {
	await dropItem(apiActor(event), event.params.id!, event.params.itemId!);
	return new Response(null, { status: 204 });
});
