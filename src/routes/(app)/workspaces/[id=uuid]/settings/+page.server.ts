import { redirect } from '@sveltejs/kit';
import { actorOf } from '$lib/server/access';
import { formAction } from '$lib/server/sharing/form-action';
import { requestContext } from '$lib/server/sharing/context';
import {
	cancelInvitation,
	handOverOwnership,
	inviteToWorkspace,
	leaveWorkspace,
	pendingInvitations,
	removeFromWorkspace,
	setMemberRole,
	updateWorkspaceSettings,
	workspaceMembers
} from '$lib/server/sharing/workspace-actions';
import { invitationSchema, inviteSchema, leaveSchema, memberRoleSchema, memberSchema, settingsSchema } from './schema';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ parent, locals }) => {
	const { workspace, canManage } = await parent();
	const actor = actorOf(locals);
	const [members, invitations] = await Promise.all([workspaceMembers(actor, workspace.id), canManage ? pendingInvitations(actor, workspace.id) : []]);
	return { members, invitations, me: locals.user!.id };
};

export const actions: Actions = {
	settings: (event) =>
		formAction(event, 'settings', settingsSchema, async (data, actor) => {
			await updateWorkspaceSettings(actor, event.params.id, data);
			return { message: 'Settings saved.' };
		}),
	invite: (event) =>
		formAction(event, 'invite', inviteSchema, async (data, actor) => {
			const invitation = await inviteToWorkspace(actor, event.params.id, data, requestContext(event));
			return { message: `Invitation sent to ${invitation.email}. It works for 7 days.` };
		}),
	revokeInvitation: (event) =>
		formAction(event, 'invitations', invitationSchema, async ({ invitationId }, actor) => {
			await cancelInvitation(actor, event.params.id, invitationId);
			return { message: 'Invitation revoked: its link no longer works.' };
		}),
	role: (event) =>
		formAction(event, 'members', memberRoleSchema, async ({ userId, role }, actor) => {
			await setMemberRole(actor, event.params.id, userId, role, requestContext(event));
			return { message: `Role changed to ${role}.` };
		}),
	remove: (event) =>
		formAction(event, 'members', memberSchema, async ({ userId }, actor) => {
			await removeFromWorkspace(actor, event.params.id, userId, requestContext(event));
			return { message: 'Removed from the workspace.' };
		}),
	transfer: (event) =>
		formAction(event, 'members', memberSchema, async ({ userId }, actor) => {
			await handOverOwnership(actor, event.params.id, userId, requestContext(event));
			return { message: 'Ownership transferred. You are now an admin.' };
		}),
	leave: (event) =>
		formAction(event, 'leave', leaveSchema, async (_data, actor) => {
			await leaveWorkspace(actor, event.params.id, requestContext(event));
			redirect(303, '/workspaces');
		})
};
