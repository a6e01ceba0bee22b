// GET /api/invitations/:token — what the invitation offers (no sign-in needed: the token is the key).
import { json } from '@sveltejs/kit';
import { ApiProblem, endpoint } from '$lib/server/api/respond';
import { findInvitation } from '$lib/server/db/invitations';

export const GET = endpoint(async (event) => {
	const invitation = await findInvitation(event.params.token!);
	if (!invitation) throw new ApiProblem(404, 'This invitation link is not valid.');
	return json({ invitation });
});
