// POST /api/sheets/:id/restore — take a sheet out of the trash.
import { json } from '@sveltejs/kit';
import { apiActor, endpoint } from '$lib/server/api/respond';
import { restoreSheetAs } from '$lib/server/sharing/sheet-actions';

export const POST = endpoint(async (event) => json({ sheet: await restoreSheetAs(apiActor(event), event.params.id!) }));
