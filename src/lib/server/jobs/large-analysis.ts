// Analyses of large networks as background jobs: above the interactive size
// (network/limits.ts) an analysis is not run inside a request but queued, like a tolerance run,
// as a row of design_jobs (kind 'large-analysis') served by the same runner (runner.ts: claim,
// heartbeat, take-over, cancel). The work runs in the design worker pool, which reports the
// solver's progress through a MessagePort; each percent is recorded on the row, so the page's
// progress bar moves and a cancel takes effect at the next percent (the worker thread is stopped).
import { MessageChannel } from 'node:worker_threads';
import { ApiProblem } from '../api/respond';
import { createDesignJob, type DesignJobRecord } from '../db/design-jobs';
import { getRevision } from '../db/sheets';
import { readRevision } from '../sharing/sheet-actions';
import type { Actor } from '../access';
import type { LargeAnalysisOptions } from '../workers/design.worker';
import { runDesign } from './design-pool';
import { enqueueDesignJob } from './design-queue';
import { startJobRunner, type JobContext } from './runner';
import { ELEMENT_LIMIT } from '../../network/limits';

export const LARGE_ANALYSIS_KIND = 'large-analysis';
/** A 100,000-element network with its full response takes under a minute on the test machine. */
const LARGE_ANALYSIS_TIMEOUT_MS = 10 * 60_000;

export interface LargeAnalysisInput extends LargeAnalysisOptions {
	sheetId: string;
	revision?: number;
}

export async function startLargeAnalysis(
	actor: Actor & { kind: 'user' },
	input: LargeAnalysisInput
): Promise<DesignJobRecord> {
	const { revision } = await readRevision(actor, input.sheetId, input.revision, 'analyze');
	const count = (revision.document as { elements?: unknown[] })?.elements?.length ?? 0;
	if (count > ELEMENT_LIMIT)
		throw new ApiProblem(413, `the network has ${count} elements; the limit is ${ELEMENT_LIMIT}`);
	const options: LargeAnalysisOptions = {
		...(input.poles !== undefined ? { poles: input.poles } : {}),
		...(input.near !== undefined ? { near: input.near } : {}),
		...(input.points !== undefined ? { points: input.points } : {})
	};
	const job = await createDesignJob({
		sheetId: input.sheetId,
		revision: revision.number,
		kind: LARGE_ANALYSIS_KIND,
		request: { options },
		total: 100,
		createdBy: actor.id
	});
	await enqueueDesignJob(job.id);
	void startJobRunner().catch(() => {});
	return job;
}

/** The job's work (called by design-queue.ts for rows of this kind). */
export async function runLargeAnalysisJob(
	{ signal, progress }: JobContext,
	job: DesignJobRecord
): Promise<Record<string, unknown>> {
	const document = (await getRevision(job.sheetId, job.revision))?.document;
	if (!document) throw new Error(`revision ${job.revision} of the sheet no longer exists`);
	const { options } = job.request as { options: LargeAnalysisOptions };
	const { port1, port2 } = new MessageChannel();
	let recording = Promise.resolve();
	let stopped: unknown = null;
	port1.on('message', ({ done }: { done: number }) => {
		// Reports are recorded in order; the first refusal (a cancel) stops the work.
		recording = recording.then(() =>
			stopped ? undefined : progress(Math.min(99, done)).catch((e) => void (stopped = e))
		);
	});
	const stopNow = new AbortController();
	const watch = setInterval(() => stopped && stopNow.abort(stopped), 200);
	try {
		const analysis = await runDesign(
			{ kind: 'large-analysis', document, options, progress: port2 },
			LARGE_ANALYSIS_TIMEOUT_MS,
			AbortSignal.any([signal, stopNow.signal]),
			[port2]
		);
		await recording;
		if (stopped) throw stopped;
		return { revision: job.revision, analysis: analysis as Record<string, unknown> };
	} finally {
		clearInterval(watch);
		port1.close();
	}
}
