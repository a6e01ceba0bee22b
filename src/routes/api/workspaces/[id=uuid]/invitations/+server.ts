// GET /api/workspaces/:id/invitations — pending ones; POST { email, role } — invite by e-mail.
import { json } from '@sveltejs/kit';
import { apiActor, endpoint, readBody } from '$lib/server/api/respond';
import { inviteBody } from '$lib/server/api/schemas';
import { requestContext } from '$lib/server/sharing/context';
import { inviteToWorkspace, pendingInvitations } from '$lib/server/sharing/workspace-actions';

export const GET = endpoint(async (event) => json({ invitations: await pendingInvitations(apiActor(event), event.params.id!) }));

export const POST = endpoint(async (event) => {
	const actor = apiActor(event);
	const input = await readBody(event.request, inviteBody);
	return json({ invitation: await inviteToWorkspace(actor, event.params.id!, input, requestContext(event)) }, { status: 201 });
});
