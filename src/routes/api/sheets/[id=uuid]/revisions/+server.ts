// GET /api/sheets/:id/revisions — the history, newest first (no documents);
// PUT { baseRevision, document, layout?, message? } — save a new revision, 409 on a stale base.
import { json } from '@sveltejs/kit';
import { apiActor, BODY_LIMITS, endpoint, readBody } from '$lib/server/api/respond';
import { saveRevisionBody } from '$lib/server/api/schemas';
import { revisionHistory, saveSheetAs } from '$lib/server/sharing/sheet-actions';

export const GET = endpoint(async (event) => json({ revisions: await revisionHistory(apiActor(event), event.params.id!) }));

export const PUT = endpoint(async (event) => {
	const actor = apiActor(event);
	const input = await readBody(event.request, saveRevisionBody, BODY_LIMITS.document);
	return json({ revision: await saveSheetAs(actor, event.params.id!, input) }, { status: 201 });
});
