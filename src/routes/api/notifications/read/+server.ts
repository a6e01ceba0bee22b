// POST /api/notifications/read { ids? } — mark those (or, without ids, all) as read.
import { json } from '@sveltejs/kit';
import { apiActor, endpoint, readBody } from '$lib/server/api/respond';
import { markRead, unreadCount } from '$lib/server/db/notifications';
import { markReadBody } from '$lib/server/review/schemas';

export const POST = endpoint(async (event) => {
	const { id } = apiActor(event);
	const { ids } = await readBody(event.request, markReadBody);
	const marked = await markRead(id, ids);
	return json({ marked, unread: await unreadCount(id) });
});
