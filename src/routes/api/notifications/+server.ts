// GET /api/notifications[?unread=1&limit=N] — your notifications, newest first, and the unread count.
import { json } from '@sveltejs/kit';
import { apiActor, endpoint } from '$lib/server/api/respond';
import { listNotifications, unreadCount } from '$lib/server/db/notifications';

export const GET = endpoint(async (event) => {
	const { id } = apiActor(event);
	const limit = Math.min(Math.max(Number(event.url.searchParams.get('limit')) || 50, 1), 200);
	const unreadOnly = event.url.searchParams.get('unread') === '1';
	const [notifications, unread] = await Promise.all([listNotifications(id, { limit, unreadOnly }), unreadCount(id)]);
	return json({ notifications, unread }, { headers: { 'cache-control': 'no-store' } });
});
