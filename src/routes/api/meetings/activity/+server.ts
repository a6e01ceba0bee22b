// GET /api/meetings/activity?workspaceId=… — the workspace's activity feed (saves, shares,
// comments, reviews, meetings), newest first; members only.
import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { authorizeWorkspace } from '$lib/server/access';
import { apiActor, endpoint } from '$lib/server/api/respond';
import { readQuery } from '$lib/server/api/schemas';
import { listActivity } from '$lib/server/db/activity';

const query = z.object({ workspaceId: z.uuid('workspaceId must be a workspace id') });

export const GET = endpoint(async (event) => {
	const { workspaceId } = readQuery(event.url, query);
	await authorizeWorkspace(apiActor(event), workspaceId, 'list');
	return json({ activity: await listActivity({ workspaceId }) });
});
