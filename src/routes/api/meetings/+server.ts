// GET /api/meetings?workspaceId=… — a workspace's review meetings, newest first;
// POST { workspaceId, title, heldOn, attendees? } — plan one.
import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiActor, endpoint, readBody } from '$lib/server/api/respond';
import { readQuery } from '$lib/server/api/schemas';
import { meetingsOf, newMeeting } from '$lib/server/review/meeting-actions';
import { newMeetingBody } from '$lib/server/review/schemas';

const query = z.object({ workspaceId: z.uuid('workspaceId must be a workspace id') });

export const GET = endpoint(async (event) => {
	const { workspaceId } = readQuery(event.url, query);
	return json({ meetings: (await meetingsOf(apiActor(event), workspaceId)).meetings });
});

export const POST = endpoint(async (event) => {
	const actor = apiActor(event);
	return json({ meeting: await newMeeting(actor, await readBody(event.request, newMeetingBody)) }, { status: 201 });
});
