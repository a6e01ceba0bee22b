// What people do with the design aids, shared by the JSON API and the sheet page: each verb
// starts with the access module, then hands the numbers to the design worker pool.
import { randomUUID } from 'node:crypto';
import { authorizeSheet, AccessDenied, type Actor } from '../access';
import { readRevision } from '../sharing/sheet-actions';
import {
	createDesignJob,
	getDesignJob,
	getDesignSettings,
	listDesignJobs,
	queueIdOf,
	saveDesignSettings,
	type DesignJobRecord
} from '../db/design-jobs';
import { requestCancel } from '../db/job-rows';
import type { DesignSettings, SpecLimits, ElementTolerance } from '../../network/design-schema';
import type { NetworkDocument } from '../../network/schema';
import { hasVariants } from '../../network/variants';
import type { VariantSpecOutcome } from '../../design/variant-spec';
import { ApiProblem } from '../api/respond';
import { checkDocument, LIMITS } from '../analysis-request';
import { runDesign } from './design-pool';
import { enqueueDesignJob, toleranceJobs } from './design-queue';
import { settleJob, startJobRunner } from './runner';
import { jobBoss } from './queue';
import type { MonteCarloRequest } from '../../design/tolerance';

type UserActor = Actor & { kind: 'user' };

/**
 * A network sent with a design request, through the same front door as POST /api/analyze: its
 * size limit (the whole body there), the element limit and the shape check naming the element.
 */
export function checkDesignNetwork(document: unknown) {
	const bytes = Buffer.byteLength(JSON.stringify(document ?? null));
	if (bytes > LIMITS.bodyBytes)
		throw new ApiProblem(
			413,
			`document: the network is ${bytes} bytes; the limit is ${LIMITS.bodyBytes}, as for /api/analyze`
		);
	return checkDocument(document);
}

export interface MonteCarloInput {
	sheetId: string;
	revision?: number;
	/** The drawing as it is now, run instead of the revision's network (which it is based on). */
	document?: unknown;
	runs?: number;
	seed?: number;
	tolerances?: ElementTolerance[];
	spec?: SpecLimits;
}

/**
 * Queue a Monte Carlo run on a stored revision (the latest unless one is named), or on the
 * network given, recorded with the revision it is based on.
 */
export async function startMonteCarlo(
	actor: UserActor,
	input: MonteCarloInput
): Promise<DesignJobRecord> {
	const { revision } = await readRevision(actor, input.sheetId, input.revision, 'analyze');
	const drawing = input.document === undefined ? null : checkDesignNetwork(input.document);
	const document = drawing ?? revision.document;
	const settings = await getDesignSettings(input.sheetId);
	const tolerances = (input.tolerances ?? settings.tolerances.elements).filter(
		(t) => t.distribution !== 'fixed' && t.tolerance > 0
	);
	if (tolerances.length === 0)
		throw new ApiProblem(
			400,
			'tolerances: give at least one element a tolerance above 0 that is not fixed',
			{ code: 'no_tolerances' }
		);
	const spec = input.spec ?? settings.spec;
	const request: MonteCarloRequest = {
		tolerances,
		runs: input.runs ?? settings.tolerances.runs,
		seed: input.seed ?? settings.tolerances.seed,
		spec
	};
	// Refuse a network or element the run could not use now, not minutes later in the queue.
	await runDesign({
		kind: 'mc-chunk',
		// The worker keeps opened networks by key: a revision's never changes, a drawing's may.
		key: drawing ? `check-${randomUUID()}` : `check-${revision.id}`,
		document,
		request,
		from: 0,
		to: 0
	});
	const job = await createDesignJob({
		sheetId: input.sheetId,
		revision: revision.number,
		kind: 'monte-carlo',
		request: drawing ? { request, document: drawing } : { request },
		total: request.runs,
		createdBy: actor.id
	});
	await enqueueDesignJob(job.id);
	// The server hook normally has the runner going already; this covers a failed start.
	void startJobRunner().catch(() => {});
	return job;
}

/**
 * The job as it stands, after access is checked. A running job whose worker is gone is settled
 * first (queued again for another worker, or ended if a cancel was asked for), so what people
 * see is never a run that nothing is running.
 */
async function visibleJob(
	actor: Actor,
	jobId: string,
	action: 'read' | 'analyze',
	beforeSettling?: () => Promise<void>
): Promise<DesignJobRecord> {
	const job = await getDesignJob(jobId);
	if (!job) throw new AccessDenied(404, 'Not found.');
	await authorizeSheet(actor, job.sheetId, action);
	await beforeSettling?.();
	if (job.state !== 'running') return (await getDesignJob(jobId))!;
	await settleJob(toleranceJobs, jobId);
	return (await getDesignJob(jobId))!;
}

export async function jobFor(actor: Actor, jobId: string): Promise<DesignJobRecord> {
	// Reading a job is also what wakes the queue runner in a freshly started process.
	void startJobRunner().catch(() => {});
	return visibleJob(actor, jobId, 'read');
}

/**
 * Cancel always ends a job: a queued one at once (its queue entry closed too), a running one at
 * its worker's next progress report, one whose worker is gone right here.
 */
export async function cancelJobFor(actor: UserActor, jobId: string): Promise<DesignJobRecord> {
	return visibleJob(actor, jobId, 'analyze', async () => {
		await requestCancel(toleranceJobs.table, jobId);
		const queueId = await queueIdOf(jobId);
		if (queueId)
			await (await jobBoss()).cancel(toleranceJobs.queue, queueId).catch(() => undefined);
	});
}

export async function jobsOfSheet(actor: Actor, sheetId: string): Promise<DesignJobRecord[]> {
	await authorizeSheet(actor, sheetId, 'read');
	void startJobRunner().catch(() => {});
	return listDesignJobs(sheetId);
}

export async function settingsOf(actor: Actor, sheetId: string): Promise<DesignSettings> {
	await authorizeSheet(actor, sheetId, 'read');
	return getDesignSettings(sheetId);
}

export async function saveSettingsOf(
	actor: UserActor,
	sheetId: string,
	settings: DesignSettings
): Promise<DesignSettings> {
	await authorizeSheet(actor, sheetId, 'save');
	return saveDesignSettings(sheetId, actor.id, settings);
}

/** Pass/fail of a stored revision against the sheet's spec limits (for comparisons and reviews). */
export async function specOfRevision(actor: Actor, sheetId: string, number?: number) {
	const { revision } = await readRevision(actor, sheetId, number, 'analyze');
	const { spec, across } = await getDesignSettings(sheetId);
	const outcome = await runDesign({ kind: 'spec', document: revision.document, spec });
	// A sheet with variants is judged per variant and across them too; the base judgement above
	// stays for callers that know one network only.
	const variants = hasVariants(revision.document as NetworkDocument)
		? ((await runDesign({
				kind: 'variant-spec',
				document: revision.document,
				spec,
				across: across ?? []
			})) as VariantSpecOutcome)
		: null;
	return {
		sheetId,
		revision: revision.number,
		spec,
		across: across ?? [],
		...(outcome as object),
		variants
	};
}
