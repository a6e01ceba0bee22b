// POST /api/invitations/:token/accept — join as the signed-in person (must be the invited address).
import { json } from '@sveltejs/kit';
import { apiActor, endpoint } from '$lib/server/api/respond';
import { acceptInvitation } from '$lib/server/db/invitations';

export const POST = endpoint(async (event) => {
	apiActor(event);
	return json({ invitation: await acceptInvitation(event.params.token!, event.locals.user!) });
});
