import { error, redirect } from '@sveltejs/kit';
import { AccessDenied, actorOf } from '$lib/server/access';
import { requireUser } from '$lib/server/auth/guard';
import { listSheets } from '$lib/server/db/sheets';
import { listMembers } from '$lib/server/db/workspaces';
import { reviewForm } from '$lib/server/review/form';
import { addItem, changeMeeting, dropItem, dropMeeting, meetingAs, OUTCOME_WORDS, recordOutcome } from '$lib/server/review/meeting-actions';
import { emptySchema, itemIdSchema, itemSchema, meetingSchema, outcomeSchema } from '../schema';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals, url, params }) => {
	requireUser(locals, url);
	try {
		const { meeting } = await meetingAs(actorOf(locals), params.meetingId);
		if (meeting.workspaceId !== params.id) error(404, 'Not found.');
		const [members, sheets] = await Promise.all([listMembers(meeting.workspaceId), listSheets(meeting.workspaceId)]);
		return {
			meeting,
			members: members.map((m) => ({ userId: m.userId, name: m.name })),
			sheets: sheets.map((s) => ({ id: s.id, name: s.name, latestRevision: s.latestRevision })),
			outcomes: OUTCOME_WORDS
		};
	} catch (e) {
		if (e instanceof AccessDenied) error(e.status, e.message);
		throw e;
	}
};

const id = (event: { params: Record<string, string> }) => event.params.meetingId;

export const actions: Actions = {
	update: (event) =>
		reviewForm(event, 'meeting', meetingSchema, async (data, actor) => {
			await changeMeeting(actor, id(event), data);
			return { message: 'Meeting saved.' };
		}, ['attendees']),
	addItem: (event) =>
		reviewForm(event, 'items', itemSchema, async (data, actor) => {
			const item = await addItem(actor, id(event), data);
			return { message: `“${item.sheetName}” revision ${item.revisionNumber} added.` };
		}),
	outcome: (event) =>
		reviewForm(event, 'items', outcomeSchema, async ({ itemId, outcome, notes }, actor) => {
			await recordOutcome(actor, id(event), itemId, { outcome, notes });
			return { message: 'Outcome saved.', itemId };
		}),
	removeItem: (event) =>
		reviewForm(event, 'items', itemIdSchema, async ({ itemId }, actor) => {
			await dropItem(actor, id(event), itemId);
			return { message: 'Item taken off the list.' };
		}),
	delete: (event) =>
		reviewForm(event, 'meeting', emptySchema, async (_d, actor) => {
			await dropMeeting(actor, id(event));
			redirect(303, `/workspaces/${event.params.id}/meetings`);
		})
};
