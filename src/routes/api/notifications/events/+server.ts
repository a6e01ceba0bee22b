// GET /api/notifications/events — server-sent events on your own channel: one per new
// notification, so the bell's count updates without a reload. Resumes after Last-Event-ID.
import { apiActor, endpoint } from '$lib/server/api/respond';
import { userChannel } from '$lib/server/live/events';
import { eventStream, startingId } from '$lib/server/live/stream';

export const GET = endpoint(async (event) => {
	const { id } = apiActor(event);
	return eventStream(userChannel(id), startingId(event.request, event.url), event.request.signal, async () => true);
});
