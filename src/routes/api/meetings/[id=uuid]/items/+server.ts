// POST /api/meetings/:id/items { sheetId, revision? } — put a sheet revision on the agenda
// (the latest when no revision is named).
import { json } from '@sveltejs/kit';
import { apiActor, endpoint, readBody } from '$lib/server/api/respond';
import { addItem } from '$lib/server/review/meeting-actions';
import { meetingItemBody } from '$lib/server/review/schemas';

export const POST = endpoint(async (event) => {
	const actor = apiActor(event);
	return json({ item: await addItem(actor, event.params.id!, await readBody(event.request, meetingItemBody)) }, { status: 201 });
});
