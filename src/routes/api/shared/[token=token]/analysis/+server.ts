// GET /api/shared/:token/analysis — the analysis of the newest revision behind a read-only link.
import { endpoint } from '$lib/server/api/respond';
import { linkActor } from '$lib/server/sharing/share-actions';
import { analysisResponse } from '$lib/server/sharing/stored-analysis';

export const GET = endpoint(async (event) => {
	const actor = await linkActor(event.params.token!);
	return analysisResponse(actor, actor.sheetId);
});
