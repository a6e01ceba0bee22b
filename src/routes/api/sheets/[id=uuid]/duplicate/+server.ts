// POST /api/sheets/:id/duplicate { name? } — a new sheet from the newest revision.
import { json } from '@sveltejs/kit';
import { apiActor, endpoint, readBody } from '$lib/server/api/respond';
import { duplicateSheetBody } from '$lib/server/api/schemas';
import { duplicateSheetAs } from '$lib/server/sharing/sheet-actions';

export const POST = endpoint(async (event) => {
	const actor = apiActor(event);
	const { name } = await readBody(event.request, duplicateSheetBody);
	return json(await duplicateSheetAs(actor, event.params.id!, name), { status: 201 });
});
