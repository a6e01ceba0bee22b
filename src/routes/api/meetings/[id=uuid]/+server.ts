// GET /api/meetings/:id — the meeting with attendees and items; PATCH { title?, heldOn?, attendees? };
// DELETE — remove it.
import { json } from '@sveltejs/kit';
import { apiActor, endpoint, readBody } from '$lib/server/api/respond';
import { changeMeeting, dropMeeting, meetingAs } from '$lib/server/review/meeting-actions';
import { changeMeetingBody } from '$lib/server/review/schemas';

export const GET = endpoint(async (event) => json({ meeting: (await meetingAs(apiActor(event), event.params.id!)).meeting }));

export const PATCH = endpoint(async (event) => {
	const actor = apiActor(event);
	return json({ meeting: await changeMeeting(actor, event.params.id!, await readBody(event.request, changeMeetingBody)) });
});

export const DELETE = endpoint(async (event) => {
	await dropMeeting(apiActor(event), event.params.id!);
	return new Response(null, { status: 204 });
});
