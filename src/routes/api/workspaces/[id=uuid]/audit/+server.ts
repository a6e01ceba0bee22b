// GET /api/workspaces/:id/audit?limit&before — security events, newest first (owners, admins).
import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { authorizeWorkspace } from '$lib/server/access';
import { apiActor, endpoint } from '$lib/server/api/respond';
import { readQuery } from '$lib/server/api/schemas';
import { listAudit } from '$lib/server/audit';

const query = z.object({
	limit: z.coerce.number().int().min(1).max(200, 'limit is at most 200').default(50),
	before: z.coerce.date({ error: 'before must be an ISO date-time' }).optional()
});

export const GET = endpoint(async (event) => {
	const { limit, before } = readQuery(event.url, query);
	await authorizeWorkspace(apiActor(event), event.params.id!, 'read_audit');
	return json({ events: await listAudit({ workspaceId: event.params.id!, limit, before }) });
});
