import { error } from '@sveltejs/kit';
import { AccessDenied, actorOf } from '$lib/server/access';
import { requireUser } from '$lib/server/auth/guard';
import { getRevision } from '$lib/server/db/sheets';
import { analyzeInPool } from '$lib/server/jobs/analysis-pool';
import { commentThreads } from '$lib/server/review/comment-actions';
import { meetingAs, OUTCOME_WORDS } from '$lib/server/review/meeting-actions';
import { reviewOverview } from '$lib/server/review/review-actions';
import type { Analysis } from '$lib/solver';
import { actions as meetingActions } from '../../+page.server';
import type { Actions, PageServerLoad } from './$types';

// One item of the meeting: the revision's headline figures and poles, its review state and open
// threads, and the outcome form; previous/next walk the list in order.
export const load: PageServerLoad = async ({ locals, url, params }) => {
	requireUser(locals, url);
	const actor = actorOf(locals);
	try {
		const { meeting } = await meetingAs(actor, params.meetingId);
		const position = Number(params.n);
		const item = meeting.items[position - 1];
		if (meeting.workspaceId !== params.id || !item) error(404, 'No such item in this meeting.');
		const revision = await getRevision(item.sheetId, item.revisionNumber);
		const [outcome, overview, threads] = await Promise.all([
			revision ? analyzeInPool({ document: revision.document, options: { frequency: { points: 120 }, step: { points: 200 } } }) : null,
			reviewOverview(actor, item.sheetId),
			commentThreads(actor, item.sheetId)
		]);
		const a = outcome?.ok ? (outcome.analysis as Analysis) : null;
		return {
			meeting: { id: meeting.id, title: meeting.title, heldOn: meeting.heldOn, workspaceId: meeting.workspaceId, count: meeting.items.length },
			item,
			position,
			outcomes: OUTCOME_WORDS,
			figures: a ? { poles: a.poles.map((p) => ({ re: p.re, im: p.im, hz: p.hz, owners: p.owners.filter((o) => o.share >= 0.2).map((o) => o.element) })), bandwidth: a.bandwidth, dcGain: a.dcGain, riseTime: a.step?.riseTime ?? null, overshoot: a.step?.overshoot ?? null } : null,
			analysisError: outcome && !outcome.ok ? outcome.error.error : null,
			review: overview.summary,
			openThreads: threads.threads.filter((t) => !t.resolvedAt && !t.deletedAt).map((t) => ({ id: t.id, anchorKind: t.anchorKind, anchorRef: t.anchorRef, authorName: t.authorName, body: t.body.slice(0, 200) }))
		};
	} catch (e) {
		if (e instanceof AccessDenied) error(e.status, e.message);
		throw e;
	}
};

// The same ?/outcome as the meeting page (it reads only the meeting id, which both routes have).
export const actions: Actions = { outcome: (event) => meetingActions.outcome(event as unknown as Parameters<typeof meetingActions.outcome>[0]) };
