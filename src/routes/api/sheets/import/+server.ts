// POST /api/sheets/import?workspace=<id> (multipart: file, optional name and workspaceId) — a new
// sheet from a sheet file or a bare network document; refused with the analyzer's own message
// (422, naming the element or node) when the network is not valid.
import { json } from '@sveltejs/kit';
import { ApiProblem, apiActor, endpoint } from '$lib/server/api/respond';
import { importSheetAs, parseSheetFile } from '$lib/server/exchange/transfer-actions';
import { readUpload } from '$lib/server/exchange/upload';
import { SHEET_FILE_MAX_BYTES } from '$lib/exchange';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export const POST = endpoint(async (event) => {
	const actor = apiActor(event);
	const upload = await readUpload(event.request, event.url, SHEET_FILE_MAX_BYTES);
	const workspaceId = upload.fields.workspaceId ?? upload.fields.workspace ?? '';
	if (!UUID.test(workspaceId))
		throw new ApiProblem(400, 'workspaceId: the workspace to import into is required.');
	const content = await parseSheetFile(upload.bytes, upload.fileName);
	const { sheet, revision } = await importSheetAs(actor, workspaceId, content, upload.fields.name);
	return json({ sheet, revision: { number: revision.number } }, { status: 201 });
});
