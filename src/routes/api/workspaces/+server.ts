// GET /api/workspaces — the caller's workspaces; POST — create one (the caller becomes owner).
import { json } from '@sveltejs/kit';
import { apiActor, endpoint, readBody } from '$lib/server/api/respond';
import { createWorkspaceBody } from '$lib/server/api/schemas';
import { listWorkspacesFor } from '$lib/server/db/workspaces';
import { newWorkspace } from '$lib/server/sharing/workspace-actions';

export const GET = endpoint(async (event) => json({ workspaces: await listWorkspacesFor(apiActor(event).id) }));

export const POST = endpoint(async (event) => {
	const actor = apiActor(event);
	const { name } = await readBody(event.request, createWorkspaceBody);
	return json({ workspace: { ...(await newWorkspace(actor, name)), role: 'owner' } }, { status: 201 });
});
