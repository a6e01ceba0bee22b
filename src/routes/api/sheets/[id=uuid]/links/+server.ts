// GET /api/sheets/:id/links — live read-only links (never their tokens);
// POST { label? } — make one; the answer carries the token and URL, shown this once only.
import { json } from '@sveltejs/kit';
import { apiActor, endpoint, readBody } from '$lib/server/api/respond';
import { linkBody } from '$lib/server/api/schemas';
import { requestContext } from '$lib/server/sharing/context';
import { newShareLink, sharingOf } from '$lib/server/sharing/share-actions';

export const GET = endpoint(async (event) => json({ links: (await sharingOf(apiActor(event), event.params.id!)).links }));

export const POST = endpoint(async (event) => {
	const actor = apiActor(event);
	const { label } = await readBody(event.request, linkBody);
	return json(await newShareLink(actor, event.params.id!, label || null, requestContext(event)), { status: 201 });
});
