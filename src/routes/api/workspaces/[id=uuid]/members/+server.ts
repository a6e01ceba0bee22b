// GET /api/workspaces/:id/members — everyone in the workspace with their role.
import { json } from '@sveltejs/kit';
import { apiActor, endpoint } from '$lib/server/api/respond';
import { workspaceMembers } from '$lib/server/sharing/workspace-actions';

export const GET = endpoint(async (event) => json({ members: await workspaceMembers(apiActor(event), event.params.id!) }));
