// GET /api/sheets/:id/grants — who has this sheet (grants, pending guest invitations, live links);
// POST { email, role } — share with a person (a guest invitation when they have no account).
import { json } from '@sveltejs/kit';
import { apiActor, endpoint, readBody } from '$lib/server/api/respond';
import { shareBody } from '$lib/server/api/schemas';
import { requestContext } from '$lib/server/sharing/context';
import { sharingOf, shareWithEmail } from '$lib/server/sharing/share-actions';

export const GET = endpoint(async (event) => json(await sharingOf(apiActor(event), event.params.id!)));

export const POST = endpoint(async (event) => {
	const actor = apiActor(event);
	const input = await readBody(event.request, shareBody);
	const result = await shareWithEmail(actor, event.params.id!, input, requestContext(event));
	return json({ ...result, email: input.email, role: input.role }, { status: 201 });
});
