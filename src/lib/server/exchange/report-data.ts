// Everything the review report of one revision shows, gathered behind the access module:
// the revision and its analysis, measured overlays with their deviation, spec pass/fail (when
// the design aids keep limits for the sheet), the open comment threads and the review state.
// Each optional part that cannot be had says why instead of failing the whole report.
import type { Actor } from '../access';
import { ApiProblem } from '../api/respond';
import { getDesignSettings } from '../db/design-jobs';
import { listMeasurementCurves } from '../db/measurements';
import { commentThreads } from '../review/comment-actions';
import { reviewOverview } from '../review/review-actions';
import {
	checkSpec,
	figuresOfAnalysis,
	isEmptySpec,
	type SpecOutcome
} from '../../design/spec-limits';
import { deviation, type Deviation } from '../../exchange';
import type { Analysis } from '../../solver';
import { revisionAnalysis, revisionFromQuery } from './stored-results';
import { reportVariants } from './report-variants';

export async function reportData(actor: Actor, sheetId: string, url: URL) {
	const { sheet, workspace, revision, role } = await revisionFromQuery(actor, sheetId, url, 'read');
	let analysis: Analysis | null = null;
	let analysisError: string | null = null;
	try {
		analysis = await revisionAnalysis(revision.document, revision.number, {
			frequency: { points: 300 }
		});
	} catch (e) {
		if (!(e instanceof ApiProblem)) throw e;
		analysisError = e.message;
	}
	const measured = await listMeasurementCurves(sheetId);
	const model = analysis?.frequencyResponse;
	const overlays = measured.map((m) => ({
		id: m.id,
		name: m.name,
		curve: m.curve,
		deviation: model ? deviation(model, m.curve) : (null as Deviation | null)
	}));

	let spec: { outcome: SpecOutcome | null; note: string | null };
	// The design aids' own data verb: their defaults (no limits) when the sheet keeps none.
	const limits = (await getDesignSettings(sheetId)).spec;
	if (isEmptySpec(limits)) spec = { outcome: null, note: 'No spec limits are set for this sheet.' };
	else if (!analysis)
		spec = {
			outcome: null,
			note: 'Spec limits could not be checked: the network was not analysed.'
		};
	else spec = { outcome: checkSpec(limits, figuresOfAnalysis(analysis, limits)), note: null };

	// A sheet with variants: each variant's analysis, and every variant against the limits and
	// the specs across variants (null without variants).
	const variants = await reportVariants(revision.document, sheetId);

	const { threads } = await commentThreads(actor, sheetId);
	const open = threads.filter((t) => !t.resolvedAt && !t.deletedAt);
	const review = await reviewOverview(actor, sheetId);
	return {
		sheet: { id: sheet.id, name: sheet.name, latestRevision: sheet.latestRevision },
		workspace: { name: workspace.name },
		role,
		revision: {
			number: revision.number,
			document: revision.document,
			layout: revision.layout,
			createdAt: revision.createdAt,
			authorId: revision.authorId,
			message: revision.message
		},
		analysis,
		analysisError,
		variants,
		overlays,
		spec,
		comments: open.map((t) => ({
			id: t.id,
			author: t.authorName,
			anchor: t.anchorRef ? `${t.anchorKind.replace('_', ' ')} ${t.anchorRef}` : t.anchorKind,
			revisionNumber: t.revisionNumber,
			bodyHtml: t.bodyHtml,
			createdAt: t.createdAt,
			replies: t.replies.filter((r) => !r.deletedAt).length
		})),
		review: {
			label: review.summary.label,
			approvedRevision: review.summary.approvedRevision,
			changedSinceApproval: review.summary.changedSinceApproval,
			requests: review.requests.filter((r) => !r.withdrawnAt).slice(0, 5)
		}
	};
}
