import { redirect } from '@sveltejs/kit';
import { requireUser } from '$lib/server/auth/guard';
import { listWorkspacesFor } from '$lib/server/db/workspaces';
import { listGuestSheets } from '$lib/server/db/grants';
import { formAction } from '$lib/server/sharing/form-action';
import { newWorkspace } from '$lib/server/sharing/workspace-actions';
import { createWorkspaceSchema } from './schema';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals, url }) => {
	const user = requireUser(locals, url);
	const [workspaces, guestSheets] = await Promise.all([listWorkspacesFor(user.id), listGuestSheets(user.id)]);
	return { workspaces, guestSheets };
};

export const actions: Actions = {
	create: (event) =>
		formAction(event, 'create', createWorkspaceSchema, async ({ name }, actor) => {
			const workspace = await newWorkspace(actor, name);
			redirect(303, `/workspaces/${workspace.id}`);
		})
};
