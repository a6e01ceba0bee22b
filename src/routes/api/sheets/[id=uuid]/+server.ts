// GET /api/sheets/:id — the sheet, the caller's role and its newest revision;
// PATCH { name } — rename; DELETE — move to the trash (?permanent=1: delete a trashed sheet for good).
import { json } from '@sveltejs/kit';
import { apiActor, endpoint, readBody } from '$lib/server/api/respond';
import { renameSheetBody } from '$lib/server/api/schemas';
import { requestContext } from '$lib/server/sharing/context';
import { destroySheetAs, readRevision, renameSheetAs, trashSheetAs } from '$lib/server/sharing/sheet-actions';

export const GET = endpoint(async (event) => {
	const { sheet, role, revision, can } = await readRevision(apiActor(event), event.params.id!);
	return json({ sheet, role, canEdit: can('save'), revision });
});

export const PATCH = endpoint(async (event) => {
	const actor = apiActor(event);
	const { name } = await readBody(event.request, renameSheetBody);
	return json({ sheet: await renameSheetAs(actor, event.params.id!, name) });
});

export const DELETE = endpoint(async (event) => {
	const actor = apiActor(event);
	const permanent = ['1', 'true'].includes(event.url.searchParams.get('permanent') ?? '');
	if (permanent) {
		await destroySheetAs(actor, event.params.id!, requestContext(event));
		return new Response(null, { status: 204 });
	}
	return json({ sheet: await trashSheetAs(actor, event.params.id!) });
});
