import { error } from '@sveltejs/kit';
import { AccessDenied, actorOf, authorizeWorkspace } from '$lib/server/access';
import { listAudit } from '$lib/server/audit';
import type { PageServerLoad } from './$types';

const PAGE = 50;

export const load: PageServerLoad = async ({ parent, url, locals }) => {
	const { workspace } = await parent();
	try {
		await authorizeWorkspace(actorOf(locals), workspace.id, 'read_audit');
	} catch (e) {
		if (e instanceof AccessDenied) error(e.status, 'Only owners and admins can read the audit log.');
		throw e;
	}
	const beforeParam = url.searchParams.get('before');
	const before = beforeParam && !Number.isNaN(Date.parse(beforeParam)) ? new Date(beforeParam) : undefined;
	const events = await listAudit({ workspaceId: workspace.id, limit: PAGE, before });
	return {
		events: events.map((e) => ({ id: e.id, type: e.type, actorName: e.actorName, actorEmail: e.actorEmail, detail: e.detail, ip: e.ip, createdAt: e.createdAt })),
		older: events.length === PAGE ? events[events.length - 1].createdAt.toISOString() : null
	};
};
