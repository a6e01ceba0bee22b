// POST /api/workspaces/:id/leave — leave the workspace (the last owner must transfer first).
import { apiActor, endpoint } from '$lib/server/api/respond';
import { requestContext } from '$lib/server/sharing/context';
import { leaveWorkspace } from '$lib/server/sharing/workspace-actions';

export const POST = endpoint(async (event) => {
	await leaveWorkspace(apiActor(event), event.params.id!, requestContext(event));
	return new Response(null, { status: 204 });
});
