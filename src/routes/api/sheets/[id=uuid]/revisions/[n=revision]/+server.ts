// GET /api/sheets/:id/revisions/:n — one revision with its document and layout (read-only).
import { json } from '@sveltejs/kit';
import { apiActor, endpoint } from '$lib/server/api/respond';
import { readRevision } from '$lib/server/sharing/sheet-actions';

export const GET = endpoint(async (event) => {
	const { revision } = await readRevision(apiActor(event), event.params.id!, Number(event.params.n));
	return json({ revision });
});
