import { error, redirect } from '@sveltejs/kit';
import { requireUser } from '$lib/server/auth/guard';
import { acceptInvitation, findInvitation, InvitationError } from '$lib/server/db/invitations';
import { failForm } from '$lib/server/auth/forms';
import type { Actions, PageServerLoad } from './$types';

// Open to signed-out visitors: the page offers sign-in or sign-up and comes back here (next=…).
export const load: PageServerLoad = async ({ params, locals }) => {
	const invitation = await findInvitation(params.token);
	if (!invitation) error(404, 'This invitation link is not valid. Ask the person who invited you for a new one.');
	const user = locals.user;
	return {
		invitation: {
			email: invitation.email,
			workspaceName: invitation.workspaceName,
			sheetName: invitation.sheetName,
			role: invitation.role,
			inviterName: invitation.inviterName,
			status: invitation.status,
			expiresAt: invitation.expiresAt
		},
		signedInAs: user?.email ?? null,
		emailMatches: user ? user.email.toLowerCase() === invitation.email : false
	};
};

export const actions: Actions = {
	accept: async ({ params, locals, url }) => {
		const user = requireUser(locals, url);
		let target: string;
		try {
			const invitation = await acceptInvitation(params.token, user);
			target = invitation.sheetId ? `/sheets/${invitation.sheetId}` : `/workspaces/${invitation.workspaceId}`;
		} catch (e) {
			if (e instanceof InvitationError) return failForm(409, { message: e.message });
			throw e;
		}
		redirect(303, target);
	}
};
