// Tolerance runs as background jobs on PostgreSQL. pg-boss (v10, the line that runs on Node 20)
// holds the queue in its own schema and hands each job to exactly one worker with
// SELECT … FOR UPDATE SKIP LOCKED, so several app processes share one queue safely; the
// design_jobs table holds what people see (progress, cancel flag, result, revision).
//
// Two steps, kept apart on purpose: `designBoss()` connects and makes sure the queue exists
// (enough to send and cancel), `startDesignRunner()` also subscribes this process to the
// queue. The server hook starts the runner when the app process starts (see
// src/hooks.server.ts), so a job queued before a restart is picked up without waiting for a
// design request; design requests still call it (idempotent) in case that start failed, e.g.
// while the database was not up yet. A job whose process died while running is handed out
// again by pg-boss after its expiry and starts over.
import PgBoss from 'pg-boss';
import { databaseUrl } from '../db/connection';
import {
	finishDesignJob,
	getDesignJob,
	reportProgress,
	startDesignJob,
	storedNetworkOf
} from '../db/design-jobs';
import { getRevision } from '../db/sheets';
import { runDesign } from './design-pool';
import { ApiProblem } from '../api/respond';
import type { MonteCarloRequest, RunRecord } from '../../design/tolerance';

export const DESIGN_QUEUE = 'design-tolerance';
/** Runs per worker call: small enough for prompt progress and cancel, large enough to amortize the hop. */
export const RUNS_PER_CHUNK = 250;
const CHUNK_TIMEOUT_MS = 120_000;

let connecting: Promise<PgBoss> | null = null;
let subscribing: Promise<PgBoss> | null = null;

/** pg-boss started and the queue created; this process does not take jobs from it yet. */
export function designBoss(): Promise<PgBoss> {
	connecting ??= (async () => {
		const boss = new PgBoss({ connectionString: databaseUrl(), max: 3 });
		boss.on('error', (e) => console.error(`design queue: ${e.message}`));
		await boss.start();
		if (!(await boss.getQueue(DESIGN_QUEUE))) {
			try {
				await boss.createQueue(DESIGN_QUEUE);
			} catch {
				// Another process created it between the check and here.
			}
		}
		return boss;
	})().catch((e) => {
		connecting = null;
		throw e;
	});
	return connecting;
}

/** Subscribe this process to the queue (once; a failed start is tried again on the next call). */
export function startDesignRunner(): Promise<PgBoss> {
	subscribing ??= (async () => {
		const boss = await designBoss();
		await boss.work<{ jobId: string }>(
			DESIGN_QUEUE,
			{ batchSize: 1, pollingIntervalSeconds: 0.5 },
			async ([job]) => {
				await runToleranceJob(job.data.jobId);
			}
		);
		return boss;
	})().catch((e) => {
		subscribing = null;
		throw e;
	});
	return subscribing;
}

/**
 * Start the runner as the app process starts. Never throws: a failure (database not up yet)
 * is logged, and the next design request tries again.
 */
export async function startDesignRunnerAtBoot(): Promise<void> {
	try {
		await startDesignRunner();
	} catch (e) {
		const reason = e instanceof Error ? e.message : String(e);
		console.error(
			`design queue: the runner did not start (${reason}); a design request will try again`
		);
	}
}

/** The runner, for callers that also want this process to take jobs (every design route). */
export const designQueue = startDesignRunner;

export async function enqueueDesignJob(jobId: string): Promise<string> {
	const boss = await designBoss();
	// One retry covers a process that died mid-run; expiry bounds how long a dead run blocks it.
	const id = await boss.send(DESIGN_QUEUE, { jobId }, { retryLimit: 1, expireInSeconds: 30 * 60 });
	if (!id) throw new ApiProblem(503, 'the job queue did not accept the run; try again');
	return id;
}

export async function cancelQueued(queueId: string | null): Promise<void> {
	if (!queueId) return;
	try {
		await (await designBoss()).cancel(DESIGN_QUEUE, queueId);
	} catch {
		// Already running or finished: the runner sees the cancel flag instead.
	}
}

interface StoredRequest {
	request: MonteCarloRequest;
}

/** Runs one Monte Carlo job chunk by chunk in the design worker pool. Never throws. */
export async function runToleranceJob(jobId: string): Promise<void> {
	const job = await getDesignJob(jobId);
	if (!job || !(await startDesignJob(jobId))) return;
	try {
		// A drawing sent with the request runs as sent; otherwise the stored revision's network.
		const document =
			(await storedNetworkOf(jobId)) ?? (await getRevision(job.sheetId, job.revision))?.document;
		if (!document) throw new Error(`revision ${job.revision} of the sheet no longer exists`);
		const { request } = job.request as StoredRequest;
		const records: RunRecord[] = [];
		for (let from = 0; from < request.runs; from += RUNS_PER_CHUNK) {
			const to = Math.min(request.runs, from + RUNS_PER_CHUNK);
			const chunk = (await runDesign(
				{ kind: 'mc-chunk', key: jobId, document, request, from, to },
				CHUNK_TIMEOUT_MS
			)) as RunRecord[];
			records.push(...chunk);
			if (!(await reportProgress(jobId, records.length))) {
				await finishDesignJob(jobId, { state: 'cancelled' });
				return;
			}
		}
		const summary = await runDesign(
			{ kind: 'mc-summary', key: jobId, document, request, records },
			CHUNK_TIMEOUT_MS
		);
		await finishDesignJob(jobId, {
			state: 'done',
			result: {
				revision: job.revision,
				source: job.source,
				...(summary as Record<string, unknown>)
			}
		});
	} catch (e) {
		await finishDesignJob(jobId, {
			state: 'failed',
			error: e instanceof Error ? e.message : String(e)
		});
	}
}

export async function stopDesignQueue(): Promise<void> {
	const s = connecting;
	connecting = null;
	subscribing = null;
	const boss = s ? await s.catch(() => null) : null;
	if (boss) await boss.stop({ graceful: true, wait: true, timeout: 5000 });
}
