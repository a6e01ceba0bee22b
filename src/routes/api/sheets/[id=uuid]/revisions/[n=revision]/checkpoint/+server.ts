// POST /api/sheets/:id/revisions/:n/checkpoint { name?, message? } — mark revision n as a
// checkpoint (the editor's explicit save, Ctrl+S): it ends its group of saves in the history.
import { json } from '@sveltejs/kit';
import { apiActor, endpoint, readBody } from '$lib/server/api/respond';
import { checkpointBody } from '$lib/server/api/schemas';
import { markCheckpointAs } from '$lib/server/sharing/sheet-actions';

export const POST = endpoint(async (event) => {
	const actor = apiActor(event);
	const { name, message } = await readBody(event.request, checkpointBody);
	const number = Number(event.params.n);
	await markCheckpointAs(actor, event.params.id!, number, name || null, message || null);
	return json({ checkpoint: { number, name: name || null, message: message || null } });
});
