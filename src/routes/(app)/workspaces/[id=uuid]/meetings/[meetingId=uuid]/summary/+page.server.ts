import { error } from '@sveltejs/kit';
import { AccessDenied, actorOf } from '$lib/server/access';
import { requireUser } from '$lib/server/auth/guard';
import { meetingAs, OUTCOME_WORDS } from '$lib/server/review/meeting-actions';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals, url, params }) => {
	requireUser(locals, url);
	try {
		const { meeting, access } = await meetingAs(actorOf(locals), params.meetingId);
		if (meeting.workspaceId !== params.id) error(404, 'Not found.');
		return { meeting, workspaceName: access.workspace.name, outcomes: OUTCOME_WORDS, printedAt: new Date().toISOString() };
	} catch (e) {
		if (e instanceof AccessDenied) error(e.status, e.message);
		throw e;
	}
};
