import { error } from '@sveltejs/kit';
import { AccessDenied, actorOf, authorizeWorkspace } from '$lib/server/access';
import { requireUser } from '$lib/server/auth/guard';
import type { LayoutServerLoad } from './$types';

// The workspace every page below works in, and what the caller may do there (for the tabs).
export const load: LayoutServerLoad = async ({ locals, url, params }) => {
	requireUser(locals, url);
	try {
		const { workspace, role, can } = await authorizeWorkspace(actorOf(locals), params.id, 'list');
		return { workspace, role, canManage: can('manage_members'), canReadAudit: can('read_audit') };
	} catch (e) {
		if (e instanceof AccessDenied) error(e.status, e.message);
		throw e;
	}
};
