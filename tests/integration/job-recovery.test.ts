// The shared job runner when workers die, hang or stop (issue: a crashed job sat at "running"
// for 30 minutes, a cancelled one stayed "running" for good, exhausted retries were never marked
// failed). A dead worker is simulated the way PostgreSQL sees one: a running row whose worker
// holds no lock; a hung one holds its lock but its heartbeat is old. The job API is called
// through its SvelteKit handlers, as a browser's poll would.
import { afterAll, afterEach, describe, expect, it } from 'vitest';
import pg from 'pg';
import { useDatabase } from './support/database';
import { dividerSheet } from './design-helpers';
import { call } from './support/handlers';
import { db } from '../../src/lib/server/db/connection';
import { createDesignJob, getDesignJob } from '../../src/lib/server/db/design-jobs';
import { JOB_LOCK_NAMESPACE } from '../../src/lib/server/db/job-rows';
import { closeDesignPool } from '../../src/lib/server/jobs/design-pool';
import { enqueueDesignJob } from '../../src/lib/server/jobs/design-queue';
import { startJobRunner, stopJobRunner } from '../../src/lib/server/jobs/all-kinds';
import * as job from '../../src/routes/api/design/jobs/[id=uuid]/+server';
import * as cancel from '../../src/routes/api/design/jobs/[id=uuid]/cancel/+server';

useDatabase();
afterEach(stopJobRunner);
afterAll(closeDesignPool);

const sleep = (ms: number) => new Promise((ok) => setTimeout(ok, ms));

async function aJob(runs = 300) {
	const { ana, sheet } = await dividerSheet();
	const request = {
		tolerances: [{ element: 'Ctop', tolerance: 0.1, distribution: 'uniform' as const }],
		runs,
		seed: 4,
		spec: {}
	};
	const created = await createDesignJob({
		sheetId: sheet.id,
		revision: 1,
		kind: 'monte-carlo',
		request: { request },
		total: runs,
		createdBy: ana.id
	});
	await enqueueDesignJob(created.id);
	return { ana, id: created.id };
}

/** Make the row look like a worker took it: running, attempt n, last heartbeat `ageSeconds` ago. */
async function runningElsewhere(id: string, attempt: number, ageSeconds: number, done = 120) {
	await db().query(
		`UPDATE design_jobs SET state = 'running', attempt = :attempt, worker_id = 'elsewhere:1:x',
			heartbeat_at = now() - make_interval(secs => :age), started_at = now(), done = :done
		WHERE id = :id`,
		{ replacements: { id, attempt, age: ageSeconds, done } }
	);
}

type Person = { id: string; email: string; name: string };

/** Progress once it has reached `atLeast` runs (or as it stands after a minute). */
async function waitForProgress(user: Person, id: string, atLeast: number): Promise<number> {
	const end = Date.now() + 60_000;
	let j = await read(user, id);
	while (j.done < atLeast && j.state !== 'done' && Date.now() < end) {
		await sleep(100);
		j = await read(user, id);
	}
	return j.done;
}

async function count(sql: string, id: string): Promise<number> {
	const [[row]] = (await db().query(sql, { replacements: { id } })) as [{ n: number }[], unknown];
	return row.n;
}
const read = async (user: Person, id: string) =>
	(await call(job.GET, { user, params: { id } })).body.job;

async function until(user: Person, id: string, states: string[], ms = 60_000) {
	const end = Date.now() + ms;
	let j = await read(user, id);
	while (!states.includes(j.state) && Date.now() < end) {
		await sleep(200);
		j = await read(user, id);
	}
	return j;
}

describe('jobs whose worker is gone', () => {
	it('a running job whose worker process ended is queued again at once, says so, and another worker completes it', async () => {
		const { ana, id } = await aJob();
		await runningElsewhere(id, 1, 5);
		const seen = await read(ana, id);
		// Reading also starts this process's runner, which may have taken it already.
		expect(seen.state === 'queued' ? seen.attempt : seen.attempt - 1).toBe(1);
		expect(seen).toMatchObject({ maxAttempts: 3 });
		expect(seen.recovery).toBe(
			'attempt 1 stopped (its process ended) at 120 of 300; resumes where it stopped'
		);
		await startJobRunner();
		const end = await until(ana, id, ['done', 'failed']);
		expect(end).toMatchObject({ state: 'done', done: 300, attempt: 2 });
		expect(end.result.runs).toBe(300);
	}, 90_000);

	it('cancel ends an orphaned job right away, with no worker alive to do it', async () => {
		const { ana, id } = await aJob();
		await runningElsewhere(id, 1, 5);
		const r = await call(cancel.POST, { user: ana, method: 'POST', params: { id } });
		expect(r.status).toBe(200);
		expect(r.body.job).toMatchObject({ state: 'cancelled', cancelRequested: true });
		expect(r.body.job.recovery).toBe(
			'cancelled; the worker running it had stopped (its process ended)'
		);
		expect(r.body.job.finishedAt).not.toBeNull();
	});

	it('a job whose worker stopped on every attempt is marked failed with that reason', async () => {
		const { ana, id } = await aJob();
		await runningElsewhere(id, 3, 5);
		const j = await read(ana, id);
		expect(j.state).toBe('failed');
		expect(j.error).toBe(
			'the worker running it stopped (its process ended) on each of its 3 attempts; it was given up so it cannot stop more workers'
		);
	});

	it('a hung worker (lock held, heartbeat silent) shows as stale, then is taken over after the stale time', async () => {
		const { ana, id } = await aJob();
		// A live session holding the attempt's lock: the worker's process is still there.
		const holder = new pg.Client({ connectionString: process.env.DATABASE_URL });
		await holder.connect();
		try {
			await holder.query('SELECT pg_advisory_lock($1, hashtext($2))', [
				JOB_LOCK_NAMESPACE,
				`${id}/1`
			]);
			await runningElsewhere(id, 1, 2);
			expect(await read(ana, id)).toMatchObject({ state: 'running', stale: false });
			// Silent for 12 s: more than two heartbeats (5 s each with the default 30 s stale time).
			await runningElsewhere(id, 1, 12);
			expect(await read(ana, id)).toMatchObject({ state: 'running', stale: true });
			await runningElsewhere(id, 1, 31);
			const j = await read(ana, id);
			// Taken over: queued again for attempt 2, unless this process's runner (started by the
			// first read) has already claimed it from the queue as attempt 2 (or even finished it)
			// between the take-over and this read. The hung attempt 1 is never what it shows.
			if (j.state === 'queued') expect(j.attempt).toBe(1);
			else
				expect(j).toMatchObject({
					state: expect.stringMatching(/^(running|done)$/),
					attempt: 2,
					stale: false
				});
			expect(j.recovery).toMatch(/^attempt 1 stopped \(no heartbeat for over 30 s\) at 120 of 300/);
			expect(
				await count(
					`SELECT count(*)::int AS n FROM design_jobs WHERE id = :id AND worker_id = 'elsewhere:1:x'`,
					id
				)
			).toBe(0);
		} finally {
			await holder.end();
		}
	});

	it('a worker that is stopped hands its job back without using an attempt; the next one resumes it, and the result is the uninterrupted one', async () => {
		const { ana, id } = await aJob(3000);
		await startJobRunner();
		// Let a few chunks finish (and be saved) before the worker stops.
		const along = await waitForProgress(ana, id, 500);
		expect(along).toBeLessThan(3000);
		await stopJobRunner();
		const back = await getDesignJob(id);
		expect(back).toMatchObject({ state: 'queued', attempt: 0 });
		expect(back!.done).toBeGreaterThanOrEqual(along);
		expect(back!.recovery).toBe(
			'attempt 1 was handed back by a worker that was stopping; resumes where it stopped'
		);
		const saved = await count(
			`SELECT coalesce(sum(count), 0)::int AS n FROM design_job_parts WHERE job_id = :id`,
			id
		);
		expect(saved).toBe(back!.done);
		await startJobRunner();
		// The next attempt continues after the saved runs: its first progress is not below them.
		expect(await waitForProgress(ana, id, 1)).toBeGreaterThanOrEqual(saved);
		const end = await until(ana, id, ['done', 'failed'], 120_000);
		expect(end).toMatchObject({ state: 'done', attempt: 1, done: 3000 });
		// Run i draws from its own stream of (seed, i): the same request run in one go gives the
		// same result, figure for figure.
		const again = await aJob(3000);
		const whole = await until(again.ana, again.id, ['done', 'failed'], 120_000);
		expect(whole.state).toBe('done');
		const { revision: r1, ...resumedResult } = (await read(ana, id)).result;
		const { revision: r2, ...wholeResult } = whole.result;
		expect([r1, r2]).toEqual([1, 1]);
		expect(resumedResult).toEqual(wholeResult);
		// Saved runs go once the job has ended.
		expect(
			await count(`SELECT count(*)::int AS n FROM design_job_parts WHERE job_id = :id`, id)
		).toBe(0);
	}, 240_000);

	it('a job whose work fails ends failed with the reason, not running', async () => {
		const { ana, id } = await aJob();
		// The revision the job runs on is gone.
		await db().query(`UPDATE design_jobs SET revision = 99 WHERE id = :id`, {
			replacements: { id }
		});
		await startJobRunner();
		const j = await until(ana, id, ['done', 'failed']);
		expect(j).toMatchObject({
			state: 'failed',
			error: 'revision 99 of the sheet no longer exists'
		});
	}, 90_000);
});
