// GET /api/workspaces/:id/sheets — one page of sheets (q, sort, dir, page, perPage, trashed);
// POST { name, document?, layout? } — create a sheet with its first revision.
import { json } from '@sveltejs/kit';
import { apiActor, BODY_LIMITS, endpoint, readBody } from '$lib/server/api/respond';
import { createSheetBody, readQuery, sheetListQuery } from '$lib/server/api/schemas';
import { listWorkspaceSheets, newSheet } from '$lib/server/sharing/sheet-actions';

export const GET = endpoint(async (event) => {
	const query = readQuery(event.url, sheetListQuery);
	const { rows, total, page, perPage } = await listWorkspaceSheets(apiActor(event), { ...query, workspaceId: event.params.id! });
	return json({ sheets: rows, total, page, perPage });
});

export const POST = endpoint(async (event) => {
	const actor = apiActor(event);
	const input = await readBody(event.request, createSheetBody, BODY_LIMITS.document);
	return json(await newSheet(actor, event.params.id!, input), { status: 201 });
});
