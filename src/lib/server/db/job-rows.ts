// The life of a background job's row, for every job table (design_jobs today; any table with
// the same lifecycle columns: id, state, attempt, worker_id, heartbeat_at, cancel_requested,
// done, result, error, recovery, queue_id, started_at, finished_at). Every change is one
// conditional UPDATE keyed on the worker and the attempt, so a worker that was presumed dead and
// comes back, a cancel and a take-over can never both win.
import { QueryTypes } from 'sequelize';
import { db } from './connection';

/** PostgreSQL advisory-lock namespace of running jobs (first key of the two-key form). */
export const JOB_LOCK_NAMESPACE = 7_319_100;

/** The SQL for "the worker running this attempt still holds its lock" (see jobs/liveness.ts). */
const lockHeld = (t: string) => `EXISTS (
	SELECT 1 FROM pg_locks l
	WHERE l.locktype = 'advisory' AND l.granted AND l.objsubid = 2
		AND l.database = (SELECT oid FROM pg_database WHERE datname = current_database())
		AND l.classid = ${JOB_LOCK_NAMESPACE}
		AND l.objid = hashtext(${t}.id::text || '/' || ${t}.attempt)::oid)`;

function table(name: string): string {
	if (!/^[a-z_]+$/.test(name)) throw new Error(`not a job table name: ${name}`);
	return name;
}

async function update(sql: string, replacements: Record<string, unknown>): Promise<number> {
	const [, count] = (await db().query(sql, { replacements, type: QueryTypes.UPDATE })) as [
		unknown,
		number
	];
	return count;
}

/** The attempt a queued job would start as now, or null when it is not queued. */
export async function nextAttempt(jobTable: string, id: string): Promise<number | null> {
	const rows = await db().query<{ attempt: number }>(
		`SELECT attempt FROM ${table(jobTable)} WHERE id = :id AND state = 'queued' AND NOT cancel_requested`,
		{ replacements: { id }, type: QueryTypes.SELECT }
	);
	return rows[0] ? rows[0].attempt + 1 : null;
}

/**
 * Take a queued job for this worker as the given attempt (its lock already held, so nobody can
 * see it running without a live worker). False when it is no longer queued at that attempt:
 * cancelled meanwhile, or another worker took it.
 */
export async function claimJob(
	jobTable: string,
	id: string,
	workerId: string,
	attempt: number,
	resumable: boolean
): Promise<boolean> {
	// A resumable job keeps the progress it had saved; any other starts from nothing again.
	const n = await update(
		`UPDATE ${table(jobTable)} SET state = 'running', attempt = :attempt, worker_id = :workerId,
			heartbeat_at = now(), started_at = coalesce(started_at, now()),
			done = CASE WHEN :resumable THEN done ELSE 0 END
		WHERE id = :id AND state = 'queued' AND attempt = :attempt - 1 AND NOT cancel_requested`,
		{ id, workerId, attempt, resumable }
	);
	return n === 1;
}

export type Beat = 'ok' | 'cancel' | 'lost';

/** "Still working on it": refreshes the heartbeat, and tells the runner whether to go on. */
export async function heartbeat(
	jobTable: string,
	id: string,
	workerId: string,
	attempt: number
): Promise<Beat> {
	const t = table(jobTable);
	const rows = await db().query<{ cancel: boolean }>(
		`UPDATE ${t} SET heartbeat_at = now()
		WHERE id = :id AND state = 'running' AND worker_id = :workerId AND attempt = :attempt
		RETURNING cancel_requested AS cancel`,
		{ replacements: { id, workerId, attempt }, type: QueryTypes.SELECT }
	);
	if (!rows[0]) return 'lost';
	return rows[0].cancel ? 'cancel' : 'ok';
}

/** Progress of this attempt (also a heartbeat); false: stop (cancelled, or no longer ours). */
export async function recordProgress(
	jobTable: string,
	id: string,
	workerId: string,
	attempt: number,
	done: number
): Promise<boolean> {
	const n = await update(
		`UPDATE ${table(jobTable)} SET done = :done, heartbeat_at = now()
		WHERE id = :id AND state = 'running' AND worker_id = :workerId AND attempt = :attempt
			AND NOT cancel_requested`,
		{ id, workerId, attempt, done }
	);
	return n === 1;
}

export type JobEnd =
	| { state: 'done'; result: Record<string, unknown> }
	| { state: 'failed'; error: string }
	| { state: 'cancelled' };

/** End this attempt. False when the job was no longer this worker's to end. */
export async function finishJob(
	jobTable: string,
	id: string,
	workerId: string,
	attempt: number,
	end: JobEnd
): Promise<boolean> {
	const n = await update(
		`UPDATE ${table(jobTable)} SET state = :state, finished_at = now(),
			result = CASE WHEN :state = 'done' THEN CAST(:result AS jsonb) ELSE result END,
			error = CASE WHEN :state = 'failed' THEN :error ELSE error END
		WHERE id = :id AND state = 'running' AND worker_id = :workerId AND attempt = :attempt`,
		{
			id,
			workerId,
			attempt,
			state: end.state,
			result: end.state === 'done' ? JSON.stringify(end.result) : null,
			error: end.state === 'failed' ? end.error : null
		}
	);
	return n === 1;
}

/** What the next attempt does with the work done so far, in the words people see. */
export const nextStart = (resumable: boolean) =>
	resumable ? 'resumes where it stopped' : 'restarted from the beginning';

/**
 * Hand a running job back to the queue (a worker that is stopping): the attempt does not
 * count, and the next worker starts it again (or resumes it).
 */
export async function releaseJob(
	jobTable: string,
	id: string,
	workerId: string,
	attempt: number,
	recovery: string
): Promise<boolean> {
	const n = await update(
		`UPDATE ${table(jobTable)} SET state = 'queued', worker_id = NULL, attempt = attempt - 1,
			recovery = :recovery, queue_id = NULL, heartbeat_at = now()
		WHERE id = :id AND state = 'running' AND worker_id = :workerId AND attempt = :attempt
			AND NOT cancel_requested`,
		{ id, workerId, attempt, recovery }
	);
	return n === 1;
}

/** Ask a job to stop: a queued one ends at once; a running one is flagged for its worker. */
export async function requestCancel(jobTable: string, id: string): Promise<void> {
	const t = table(jobTable);
	await update(
		`UPDATE ${t} SET state = 'cancelled', cancel_requested = true, finished_at = now()
		WHERE id = :id AND state = 'queued'`,
		{ id }
	);
	await update(`UPDATE ${t} SET cancel_requested = true WHERE id = :id AND state = 'running'`, {
		id
	});
}

export interface Orphan {
	id: string;
	attempt: number;
	cancelRequested: boolean;
	queueId: string | null;
	/** Its worker's lock is gone (the process ended) rather than only its heartbeat late. */
	processEnded: boolean;
}

/**
 * Running jobs nobody is working on: the worker's lock is gone (its process ended: PostgreSQL
 * drops the lock with the connection; a worker takes the lock before it claims), or the
 * heartbeat is older than `staleSeconds` (a hung worker, or a machine that vanished without
 * closing its connection).
 */
export async function findOrphans(
	jobTable: string,
	staleSeconds: number,
	onlyId?: string
): Promise<Orphan[]> {
	const t = table(jobTable);
	return db().query<Orphan>(
		`SELECT id, attempt, cancel_requested AS "cancelRequested", queue_id AS "queueId",
			NOT ${lockHeld(t)} AS "processEnded"
		FROM ${t}
		WHERE state = 'running' ${onlyId ? 'AND id = :onlyId' : ''}
			AND (heartbeat_at IS NULL
				OR heartbeat_at < now() - make_interval(secs => :stale)
				OR NOT ${lockHeld(t)})`,
		{ replacements: { stale: staleSeconds, onlyId: onlyId ?? null }, type: QueryTypes.SELECT }
	);
}

/**
 * Settle one orphan: cancelled when a cancel was asked for, failed when it has used all its
 * attempts, else queued again for another worker. Conditional on the attempt, so of several
 * processes sweeping at once exactly one acts. Returns what it did, or null when another did.
 */
export async function settleOrphan(
	jobTable: string,
	orphan: Orphan,
	maxAttempts: number,
	how: string,
	resumable: boolean
): Promise<'cancelled' | 'failed' | 'requeued' | null> {
	const t = table(jobTable);
	const where = `WHERE id = :id AND state = 'running' AND attempt = :attempt`;
	const replacements = { id: orphan.id, attempt: orphan.attempt, how, next: nextStart(resumable) };
	if (orphan.cancelRequested) {
		const n = await update(
			`UPDATE ${t} SET state = 'cancelled', finished_at = now(),
				recovery = 'cancelled; the worker running it had stopped (' || :how || ')' ${where}`,
			replacements
		);
		return n ? 'cancelled' : null;
	}
	if (orphan.attempt >= maxAttempts) {
		const n = await update(
			`UPDATE ${t} SET state = 'failed', finished_at = now(),
				error = 'the worker running it stopped (' || :how || ') on each of its ' || attempt || ' attempts; it was given up so it cannot stop more workers' ${where}`,
			replacements
		);
		return n ? 'failed' : null;
	}
	const n = await update(
		`UPDATE ${t} SET state = 'queued', worker_id = NULL, queue_id = NULL, heartbeat_at = now(),
			recovery = 'attempt ' || attempt || ' stopped (' || :how || ') at ' || to_char(done, 'FM999,999,990') || ' of ' || to_char(total, 'FM999,999,990') || '; ' || :next ${where}`,
		replacements
	);
	return n ? 'requeued' : null;
}

/**
 * Queued jobs with no live queue entry (the process that queued or re-queued them died before
 * sending, or the entry was lost): they would wait for ever. Older than a few seconds, so a
 * job being queued right now is not taken for one.
 */
export async function findUnsent(jobTable: string, queueSchema = 'pgboss'): Promise<string[]> {
	const t = table(jobTable);
	const rows = await db().query<{ id: string }>(
		`SELECT id FROM ${t} j
		WHERE state = 'queued' AND coalesce(heartbeat_at, created_at) < now() - interval '10 seconds'
			AND (queue_id IS NULL OR NOT EXISTS (
				SELECT 1 FROM ${table(queueSchema)}.job q
				WHERE q.id::text = j.queue_id AND q.state < 'completed'))`,
		{ type: QueryTypes.SELECT }
	);
	return rows.map((r) => r.id);
}

export async function setQueueEntry(jobTable: string, id: string, queueId: string): Promise<void> {
	await update(`UPDATE ${table(jobTable)} SET queue_id = :queueId WHERE id = :id`, { id, queueId });
}
