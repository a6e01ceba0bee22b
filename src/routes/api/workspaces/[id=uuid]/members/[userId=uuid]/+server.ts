// PATCH /api/workspaces/:id/members/:userId — change a role; DELETE — remove (yourself: leave).
import { json } from '@sveltejs/kit';
import { apiActor, endpoint, readBody } from '$lib/server/api/respond';
import { memberRoleBody } from '$lib/server/api/schemas';
import { requestContext } from '$lib/server/sharing/context';
import { removeFromWorkspace, setMemberRole } from '$lib/server/sharing/workspace-actions';

export const PATCH = endpoint(async (event) => {
	const actor = apiActor(event);
	const { role } = await readBody(event.request, memberRoleBody);
	await setMemberRole(actor, event.params.id!, event.params.userId!, role, requestContext(event));
	return json({ userId: event.params.userId, role });
});

export const DELETE = endpoint(async (event) => {
	await removeFromWorkspace(apiActor(event), event.params.id!, event.params.userId!, requestContext(event));
	return new Response(null, { status: 204 });
});
