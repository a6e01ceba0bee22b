// DELETE /api/workspaces/:id/invitations/:invitationId — revoke a pending invitation.
import { apiActor, endpoint } from '$lib/server/api/respond';
import { cancelInvitation } from '$lib/server/sharing/workspace-actions';

export const DELETE = endpoint(async (event) => {
	await cancelInvitation(apiActor(event), event.params.id!, event.params.invitationId!);
	return new Response(null, { status: 204 });
});
