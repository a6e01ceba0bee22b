// GET /api/shared/:token — what a read-only link shows: the sheet's name and newest revision.
// No account needed; the token is the credential, so nothing here changes anything.
import { json } from '@sveltejs/kit';
import { endpoint } from '$lib/server/api/respond';
import { linkActor } from '$lib/server/sharing/share-actions';
import { readRevision } from '$lib/server/sharing/sheet-actions';

export const GET = endpoint(async (event) => {
	const actor = await linkActor(event.params.token!);
	const { sheet, revision } = await readRevision(actor, actor.sheetId);
	return json({ sheet: { id: sheet.id, name: sheet.name, status: sheet.status, updatedAt: sheet.updatedAt }, role: 'link', revision });
});
