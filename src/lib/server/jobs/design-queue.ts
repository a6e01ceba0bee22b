// Tolerance runs (Monte Carlo) and large-network analyses as background jobs: one job kind of the shared runner
// (runner.ts: claiming, heartbeat, take-over after a crash, cancel, failure), whose rows are
// the design_jobs table (what people see: progress, cancel flag, result, revision). The work
// goes chunk by chunk through the design worker pool, saving each chunk (design_job_parts) and
// reporting progress after it, so a job taken over after a crash resumes where it stopped.
import { getDesignJob, savedRuns, saveRuns, storedNetworkOf } from '../db/design-jobs';
import { getRevision } from '../db/sheets';
import { runDesign } from './design-pool';
import { ApiProblem } from '../api/respond';
import { defineJobKind, enqueueJob, type JobContext } from './runner';
import { LARGE_ANALYSIS_KIND, runLargeAnalysisJob } from './large-analysis';
import type { MonteCarloRequest, RunRecord } from '../../design/tolerance';

export const DESIGN_QUEUE = 'design-tolerance';
/** Runs per worker call: small enough for prompt progress and cancel, large enough to amortize the hop. */
export const RUNS_PER_CHUNK = 250;
const CHUNK_TIMEOUT_MS = 120_000;

interface StoredRequest {
	request: MonteCarloRequest;
}

/** One Monte Carlo job, chunk by chunk in the design worker pool. */
async function runToleranceJob(ctx: JobContext): Promise<Record<string, unknown>> {
	const { id, signal, progress } = ctx;
	const job = await getDesignJob(id);
	if (!job) throw new Error('the job no longer exists');
	// Large-network analyses share the table and the runner (large-analysis.ts).
	if (job.kind === LARGE_ANALYSIS_KIND) return runLargeAnalysisJob(ctx, job);
	// A drawing sent with the request runs as sent; otherwise the stored revision's network.
	const document =
		(await storedNetworkOf(id)) ?? (await getRevision(job.sheetId, job.revision))?.document;
	if (!document) throw new Error(`revision ${job.revision} of the sheet no longer exists`);
	const { request } = job.request as StoredRequest;
	// A job taken over from a worker that stopped continues after the runs it saved; run i draws
	// from its own stream of (seed, i), so the result is the one an uninterrupted run gives.
	const records = await savedRuns<RunRecord>(id);
	if (records.length) await progress(records.length);
	for (let from = records.length; from < request.runs; from += RUNS_PER_CHUNK) {
		const to = Math.min(request.runs, from + RUNS_PER_CHUNK);
		const chunk = (await runDesign(
			{ kind: 'mc-chunk', key: id, document, request, from, to },
			CHUNK_TIMEOUT_MS,
			signal
		)) as RunRecord[];
		await saveRuns(id, from, chunk);
		records.push(...chunk);
		await progress(records.length);
	}
	const summary = await runDesign(
		{ kind: 'mc-summary', key: id, document, request, records },
		CHUNK_TIMEOUT_MS,
		signal
	);
	return { revision: job.revision, source: job.source, ...(summary as Record<string, unknown>) };
}

export const toleranceJobs = defineJobKind({
	queue: DESIGN_QUEUE,
	table: 'design_jobs',
	run: runToleranceJob,
	resumable: true
});

export async function enqueueDesignJob(jobId: string): Promise<string> {
	try {
		return await enqueueJob(toleranceJobs, jobId);
	} catch {
		throw new ApiProblem(503, 'the job queue did not accept the run; try again');
	}
}
