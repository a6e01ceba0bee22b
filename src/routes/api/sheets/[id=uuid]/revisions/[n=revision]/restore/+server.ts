// POST /api/sheets/:id/revisions/:n/restore { baseRevision? } — save revision n's content as a new
// revision. With baseRevision, a newer save in between answers 409 like any other save.
import { json } from '@sveltejs/kit';
import { apiActor, endpoint, readBody } from '$lib/server/api/respond';
import { restoreRevisionBody } from '$lib/server/api/schemas';
import { restoreRevisionAs } from '$lib/server/sharing/sheet-actions';

export const POST = endpoint(async (event) => {
	const actor = apiActor(event);
	const { baseRevision } = await readBody(event.request, restoreRevisionBody);
	return json({ revision: await restoreRevisionAs(actor, event.params.id!, Number(event.params.n), baseRevision) }, { status: 201 });
});
