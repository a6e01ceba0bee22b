// GET /api/workspaces/:id — the workspace and the caller's role; PATCH — name, default sheet role.
import { json } from '@sveltejs/kit';
import { authorizeWorkspace } from '$lib/server/access';
import { apiActor, endpoint, readBody } from '$lib/server/api/respond';
import { updateWorkspaceBody } from '$lib/server/api/schemas';
import { updateWorkspaceSettings } from '$lib/server/sharing/workspace-actions';

export const GET = endpoint(async (event) => {
	const { workspace, role } = await authorizeWorkspace(apiActor(event), event.params.id!, 'list');
	return json({ workspace: { ...workspace, role } });
});

export const PATCH = endpoint(async (event) => {
	const actor = apiActor(event);
	const changes = await readBody(event.request, updateWorkspaceBody);
	return json({ workspace: await updateWorkspaceSettings(actor, event.params.id!, changes) });
});
