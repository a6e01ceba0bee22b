// PATCH /api/sheets/:id/grants/:userId { role } — change a grant; DELETE — withdraw it.
import { json } from '@sveltejs/kit';
import { apiActor, endpoint, readBody } from '$lib/server/api/respond';
import { grantRoleBody } from '$lib/server/api/schemas';
import { requestContext } from '$lib/server/sharing/context';
import { changeGrant, unshare } from '$lib/server/sharing/share-actions';

export const PATCH = endpoint(async (event) => {
	const actor = apiActor(event);
	const { role } = await readBody(event.request, grantRoleBody);
	await changeGrant(actor, event.params.id!, event.params.userId!, role, requestContext(event));
	return json({ userId: event.params.userId, role });
});

export const DELETE = endpoint(async (event) => {
	await unshare(apiActor(event), event.params.id!, event.params.userId!, requestContext(event));
	return new Response(null, { status: 204 });
});
