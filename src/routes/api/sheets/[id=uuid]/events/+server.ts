// GET /api/sheets/:id/events — server-sent events for people viewing the sheet: new comments,
// review requests and answers, new revisions. Resumes after Last-Event-ID (or ?after=N).
import { authorizeSheet } from '$lib/server/access';
import { apiActor, endpoint } from '$lib/server/api/respond';
import { sheetChannel } from '$lib/server/live/events';
import { eventStream, startingId } from '$lib/server/live/stream';

export const GET = endpoint(async (event) => {
	const actor = apiActor(event);
	const { sheet } = await authorizeSheet(actor, event.params.id!, 'read');
	const stillAllowed = () => authorizeSheet(actor, sheet.id, 'read').then(() => true, () => false);
	return eventStream(sheetChannel(sheet.id), startingId(event.request, event.url), event.request.signal, stillAllowed);
});
