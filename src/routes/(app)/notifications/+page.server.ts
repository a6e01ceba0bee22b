import { fail } from '@sveltejs/kit';
import { requireUser } from '$lib/server/auth/guard';
import { listNotifications, markRead, unreadCount } from '$lib/server/db/notifications';
import { readOneSchema } from './schema';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals, url }) => {
	const user = requireUser(locals, url);
	const [notifications, unread] = await Promise.all([listNotifications(user.id, { limit: 100 }), unreadCount(user.id)]);
	return { notifications, unread };
};

export const actions: Actions = {
	read: async ({ locals, request }) => {
		const user = requireUser(locals);
		const parsed = readOneSchema.safeParse(Object.fromEntries(await request.formData()));
		if (!parsed.success) return fail(400, { message: parsed.error.issues[0].message });
		await markRead(user.id, [parsed.data.id]);
		return { message: null };
	},
	readAll: async ({ locals }) => {
		const user = requireUser(locals);
		const marked = await markRead(user.id);
		return { message: marked ? `${marked} marked as read.` : 'Nothing was unread.' };
	}
};
