// POST /api/workspaces/:id/transfer { userId } — make a member the owner; you become an admin.
import { json } from '@sveltejs/kit';
import { apiActor, endpoint, readBody } from '$lib/server/api/respond';
import { transferBody } from '$lib/server/api/schemas';
import { requestContext } from '$lib/server/sharing/context';
import { handOverOwnership } from '$lib/server/sharing/workspace-actions';

export const POST = endpoint(async (event) => {
	const actor = apiActor(event);
	const { userId } = await readBody(event.request, transferBody);
	await handOverOwnership(actor, event.params.id!, userId, requestContext(event));
	return json({ owner: userId, you: 'admin' });
});
