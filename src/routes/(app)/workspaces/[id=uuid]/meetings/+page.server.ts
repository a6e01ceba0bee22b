import { error, redirect } from '@sveltejs/kit';
import { AccessDenied, actorOf } from '$lib/server/access';
import { requireUser } from '$lib/server/auth/guard';
import { listActivity } from '$lib/server/db/activity';
import { reviewForm } from '$lib/server/review/form';
import { meetingsOf, newMeeting } from '$lib/server/review/meeting-actions';
import { meetingSchema } from './schema';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals, url, params }) => {
	requireUser(locals, url);
	try {
		const { meetings, members } = await meetingsOf(actorOf(locals), params.id);
		return { meetings, members: members.map((m) => ({ userId: m.userId, name: m.name })), activity: await listActivity({ workspaceId: params.id }, 30) };
	} catch (e) {
		if (e instanceof AccessDenied) error(e.status, e.message);
		throw e;
	}
};

export const actions: Actions = {
	create: (event) =>
		reviewForm(
			event,
			'create',
			meetingSchema,
			async (data, actor) => {
				const meeting = await newMeeting(actor, { workspaceId: event.params.id!, ...data });
				redirect(303, `/workspaces/${event.params.id}/meetings/${meeting.id}`);
			},
			['attendees']
		)
};
