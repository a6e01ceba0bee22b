// DELETE /api/sheets/:id/links/:linkId — revoke a read-only link; it stops working at once.
import { apiActor, endpoint } from '$lib/server/api/respond';
import { requestContext } from '$lib/server/sharing/context';
import { endShareLink } from '$lib/server/sharing/share-actions';

export const DELETE = endpoint(async (event) => {
	await endShareLink(apiActor(event), event.params.id!, event.params.linkId!, requestContext(event));
	return new Response(null, { status: 204 });
});
