// DELETE /api/sheets/:id/invitations/:invitationId — revoke a pending guest invitation.
import { apiActor, endpoint } from '$lib/server/api/respond';
import { cancelGuestInvitation } from '$lib/server/sharing/share-actions';

export const DELETE = endpoint(async (event) => {
	await cancelGuestInvitation(apiActor(event), event.params.id!, event.params.invitationId!);
	return new Response(null, { status: 204 });
});
