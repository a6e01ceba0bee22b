// The one job runner every background job kind goes through (tolerance runs today; any kind
// defined with `defineJobKind`). What it guarantees, whatever the kind:
//
// - a job runs on one worker at a time: the row is claimed with a conditional UPDATE, and every
//   later write is keyed on (worker, attempt);
// - a heartbeat every POLEWISE_JOB_STALE_SECONDS / 6 and an advisory lock per attempt
//   (liveness.ts), so a job whose worker died is found by the sweep of any process within
//   seconds (process ended) or after the stale time (machine gone, process hung) — well inside a
//   minute with the defaults — and queued again for another worker, restarting from the
//   beginning; the row's `recovery` says so to the people watching;
// - cancel always ends a job: a queued one at once, a running one at its next progress report,
//   an orphaned one (no live worker) when anyone next looks at it or sweeps;
// - a job whose worker stopped on each of its POLEWISE_JOB_ATTEMPTS attempts is marked failed
//   with that reason, and so is a job whose work throws (its message is the reason);
// - a worker that is stopped (SIGTERM) hands its job back to the queue without using up an
//   attempt.
//
// pg-boss only delivers: entries are sent without retries (the sweep re-sends instead) and with
// the longest expiry it allows, so the queue never acts on a job behind the row's back.
import os from 'node:os';
import { randomUUID } from 'node:crypto';
import { config, takesJobs } from '../config';
import * as rows from '../db/job-rows';
import { closeLockClient, holdJobLock } from './liveness';
import { jobBoss, queueFor, stopBoss } from './queue';

export interface JobContext {
	id: string;
	/** 1 for the first start; more after take-overs. */
	attempt: number;
	/** Aborted when the job must stop (cancelled, taken over, worker stopping). */
	signal: AbortSignal;
	/** Record progress; throws JobStopped when the job must stop instead of going on. */
	progress(done: number): Promise<void>;
}

export interface JobKind {
	/** pg-boss queue name (one per kind). */
	queue: string;
	/** The table of its rows, with the lifecycle columns of db/job-rows.ts. */
	table: string;
	/** Do the work; resolves to the result stored with the job, or throws the reason it failed. */
	run(ctx: JobContext): Promise<Record<string, unknown>>;
	/**
	 * The kind saves its progress and continues from it when a job is taken over (its `done`
	 * is kept); otherwise every attempt starts from nothing.
	 */
	resumable?: boolean;
}

export class JobStopped extends Error {
	constructor(readonly why: 'cancel' | 'lost' | 'shutdown') {
		super(`job stopped (${why})`);
	}
}

/** This process among all workers: machine, process id, and a nonce against pid reuse. */
export const WORKER_ID = `${os.hostname()}:${process.pid}:${randomUUID().slice(0, 8)}`;

const kinds = new Map<string, JobKind>();
const active = new Map<string, { stop: (why: JobStopped['why']) => void; done: Promise<void> }>();
let subscribing: Promise<void> | null = null;
let sweeper: ReturnType<typeof setInterval> | null = null;

export function defineJobKind(kind: JobKind): JobKind {
	kinds.set(kind.queue, kind);
	return kind;
}

const staleSeconds = () => config().jobStaleSeconds;
const heartbeatMs = () => Math.max(1000, (staleSeconds() * 1000) / 6);

/** Put a job's row on the queue (a new job, or one given back) and remember the entry. */
export async function enqueueJob(kind: JobKind, id: string): Promise<string> {
	const boss = await queueFor(kind.queue);
	const queueId = await boss.send(kind.queue, { jobId: id }, { retryLimit: 0, expireInHours: 23 });
	if (!queueId) throw new Error(`the job queue ${kind.queue} did not accept job ${id}`);
	await rows.setQueueEntry(kind.table, id, queueId);
	return queueId;
}

async function runOne(kind: JobKind, id: string): Promise<void> {
	const attempt = await rows.nextAttempt(kind.table, id);
	if (attempt === null) return; // cancelled meanwhile, or another worker has it
	// Lock first, then claim: a running row always has its live worker's lock.
	const release = await holdJobLock(id, attempt);
	if (!(await rows.claimJob(kind.table, id, WORKER_ID, attempt, !!kind.resumable)))
		return void (await release());
	const controller = new AbortController();
	let why: JobStopped['why'] | null = null;
	const stop = (reason: JobStopped['why']) => {
		if (why) return;
		why = reason;
		controller.abort(new JobStopped(reason));
	};
	const beat = setInterval(() => {
		rows
			.heartbeat(kind.table, id, WORKER_ID, attempt)
			.then((b) => b !== 'ok' && stop(b))
			.catch(() => undefined); // a database blip: the next beat tries again
	}, heartbeatMs());
	const ctx: JobContext = {
		id,
		attempt,
		signal: controller.signal,
		async progress(done) {
			if (!why && !(await rows.recordProgress(kind.table, id, WORKER_ID, attempt, done))) {
				const b = await rows.heartbeat(kind.table, id, WORKER_ID, attempt);
				stop(b === 'cancel' ? 'cancel' : 'lost');
			}
			if (why) throw new JobStopped(why);
		}
	};
	let settle!: () => void;
	active.set(id, { stop, done: new Promise((ok) => (settle = ok)) });
	try {
		const result = await kind.run(ctx);
		await rows.finishJob(
			kind.table,
			id,
			WORKER_ID,
			attempt,
			why === 'cancel' ? { state: 'cancelled' } : { state: 'done', result }
		);
	} catch (e) {
		if (why === 'cancel')
			await rows.finishJob(kind.table, id, WORKER_ID, attempt, { state: 'cancelled' });
		else if (why === 'shutdown') {
			if (
				await rows.releaseJob(
					kind.table,
					id,
					WORKER_ID,
					attempt,
					`attempt ${attempt} was handed back by a worker that was stopping; ${rows.nextStart(!!kind.resumable)}`
				)
			)
				await enqueueJob(kind, id).catch(() => undefined); // the sweep re-sends it otherwise
		} else if (why !== 'lost') {
			await rows.finishJob(kind.table, id, WORKER_ID, attempt, {
				state: 'failed',
				error: e instanceof Error ? e.message : String(e)
			});
		}
		// 'lost': another worker has taken it over; this attempt writes nothing more.
	} finally {
		clearInterval(beat);
		active.delete(id);
		settle();
		await release();
	}
}

/** Settle orphans of one kind (all, or the one job named) and re-send entries that went missing. */
async function sweepKind(kind: JobKind, onlyId?: string): Promise<void> {
	const { jobMaxAttempts } = config();
	for (const orphan of await rows.findOrphans(kind.table, staleSeconds(), onlyId)) {
		const how = orphan.processEnded
			? 'its process ended'
			: `no heartbeat for over ${staleSeconds()} s`;
		const did = await rows.settleOrphan(kind.table, orphan, jobMaxAttempts, how, !!kind.resumable);
		if (!did) continue;
		console.log(`jobs: ${kind.queue} ${orphan.id} attempt ${orphan.attempt}: ${how}; ${did}`);
		// Its old entry is still "active" in pg-boss: close it so the queue's count stays true.
		if (orphan.queueId)
			await (await jobBoss()).cancel(kind.queue, orphan.queueId).catch(() => undefined);
		if (did === 'requeued') await enqueueJob(kind, orphan.id);
	}
	if (!onlyId) for (const id of await rows.findUnsent(kind.table)) await enqueueJob(kind, id);
}

/**
 * Check one job before showing it or cancelling it: if its worker is gone, settle it now (a
 * cancelled orphan ends here, without waiting for any worker to be alive).
 */
export async function settleJob(kind: JobKind, id: string): Promise<void> {
	try {
		await sweepKind(kind, id);
	} catch (e) {
		console.error(`jobs: could not check job ${id}: ${e instanceof Error ? e.message : e}`);
	}
}

async function sweepAll(): Promise<void> {
	for (const kind of kinds.values()) {
		try {
			await sweepKind(kind);
		} catch (e) {
			console.error(`jobs: sweep of ${kind.queue} failed: ${e instanceof Error ? e.message : e}`);
		}
	}
}

/**
 * Subscribe this process to every job kind and start the sweep (once; a failed start is tried
 * again on the next call). A web-only process (POLEWISE_ROLE=web) subscribes to nothing.
 */
export function startJobRunner(): Promise<void> {
	if (!takesJobs()) return Promise.resolve();
	subscribing ??= (async () => {
		for (const kind of kinds.values()) {
			const boss = await queueFor(kind.queue);
			await boss.work<{ jobId: string }>(
				kind.queue,
				{ batchSize: 1, pollingIntervalSeconds: 0.5 },
				async ([job]) => runOne(kind, job.data.jobId)
			);
		}
		sweeper ??= setInterval(() => void sweepAll(), heartbeatMs());
		void sweepAll();
	})().catch((e) => {
		subscribing = null;
		throw e;
	});
	return subscribing;
}

/** As the process starts: never throws; a failure (database not up yet) is logged. */
export async function startJobRunnerAtBoot(): Promise<void> {
	try {
		await startJobRunner();
	} catch (e) {
		const reason = e instanceof Error ? e.message : String(e);
		console.error(`job queue: the runner did not start (${reason}); a job request will try again`);
	}
}

/**
 * Stop taking jobs, hand running ones back to the queue (another worker continues them), and
 * disconnect. Used on SIGTERM/SIGINT and by tests.
 */
export async function stopJobRunner(): Promise<void> {
	if (sweeper) clearInterval(sweeper);
	sweeper = null;
	const wasSubscribed = subscribing;
	subscribing = null;
	if (wasSubscribed) {
		const boss = await jobBoss().catch(() => null);
		for (const kind of kinds.values()) await boss?.offWork(kind.queue).catch(() => undefined);
	}
	const running = [...active.values()];
	for (const job of running) job.stop('shutdown');
	await Promise.all(running.map((j) => j.done));
	await stopBoss();
	await closeLockClient();
}
