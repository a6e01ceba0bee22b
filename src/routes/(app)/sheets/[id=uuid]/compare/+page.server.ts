import { error } from '@sveltejs/kit';
import { AccessDenied, actorOf } from '$lib/server/access';
import { ApiProblem } from '$lib/server/api/respond';
import { requireUser } from '$lib/server/auth/guard';
import { compareRevisions } from '$lib/server/review/compare';
import { compareSpec } from '$lib/server/review/spec-compare';
import { readRevision, revisionHistory } from '$lib/server/sharing/sheet-actions';
import type { NetworkDocument } from '$lib/network/schema';
import type { PageServerLoad } from './$types';

const pick = (s: { id: string; name: string; latestRevision: number }) => ({
	id: s.id,
	name: s.name,
	latestRevision: s.latestRevision
});

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
		if (from === to)
			return {
				sheet: pick(sheet),
				history,
				from,
				to,
				comparison: null,
				spec: null,
				drawings: null
			};
		// The drawings come with each revision (the stored canvas layout, or none: then laid out
		// automatically in the browser); the spec verdicts from the design aids' own judge.
		const [comparison, spec, a, b] = await Promise.all([
			compareRevisions(actor, sheet.id, from, to),
			compareSpec(actor, sheet.id, from, to),
			readRevision(actor, sheet.id, from),
			readRevision(actor, sheet.id, to)
		]);
		const drawing = (r: typeof a.revision) => ({
			number: r.number,
			document: r.document as NetworkDocument,
			layout: r.layout
		});
		return {
			sheet: pick(sheet),
			history,
			from,
			to,
			comparison,
			spec,
			drawings: { from: drawing(a.revision), to: drawing(b.revision) }
		};
	} catch (e) {
		if (e instanceof AccessDenied) error(e.status === 409 ? 404 : e.status, e.message);
		if (e instanceof ApiProblem) error(e.status, e.message);
		throw e;
	}
};
