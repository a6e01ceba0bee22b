import { error } from '@sveltejs/kit';
import { AccessDenied, actorOf } from '$lib/server/access';
import { ApiProblem } from '$lib/server/api/respond';
import { requireUser } from '$lib/server/auth/guard';
import { compareRevisions } from '$lib/server/review/compare';
import { readRevision, revisionHistory } from '$lib/server/sharing/sheet-actions';
import type { PageServerLoad } from './$types';

// ?from=A&to=B; without them, the revision before the latest against the latest.
export const load: PageServerLoad = async ({ params, url, locals }) => {
	requireUser(locals, url);
	const actor = actorOf(locals);
	const num = (name: string) => {
		const v = url.searchParams.get(name);
		return v && /^[1-9]\d{0,8}$/.test(v) ? Number(v) : undefined;
	};
	try {
		const { sheet } = await readRevision(actor, params.id);
		const history = await revisionHistory(actor, sheet.id);
		const to = num('to') ?? sheet.latestRevision;
		const from = num('from') ?? Math.max(1, to - 1);
		const comparison = from === to ? null : await compareRevisions(actor, sheet.id, from, to);
		return { sheet: { id: sheet.id, name: sheet.name, latestRevision: sheet.latestRevision }, history, from, to, comparison };
	} catch (e) {
		if (e instanceof AccessDenied) error(e.status === 409 ? 404 : e.status, e.message);
		if (e instanceof ApiProblem) error(e.status, e.message);
		throw e;
	}
};
