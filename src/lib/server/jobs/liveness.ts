// How other processes know a worker is alive without waiting for its heartbeat to go stale: while
// it runs a job, the worker holds a PostgreSQL advisory lock keyed by the job and attempt, on one
// connection of its own. When the process dies (SIGKILL, out of memory, a crash) the kernel closes
// its socket, PostgreSQL ends the session and drops the lock at once, and the next sweep (any
// process) sees it gone. A machine that vanishes without closing the connection is caught by
// the heartbeat instead (POLEWISE_JOB_STALE_SECONDS).
import pg from 'pg';
import { databaseUrl } from '../db/connection';
import { JOB_LOCK_NAMESPACE } from '../db/job-rows';

let client: Promise<pg.Client> | null = null;

function lockClient(): Promise<pg.Client> {
	client ??= (async () => {
		const c = new pg.Client({ connectionString: databaseUrl() });
		// A lost connection loses every lock on it: the sweep then hands those jobs to other
		// workers, and this process's runners learn it at their next heartbeat and stop.
		const forget = () => {
			client = null;
		};
		c.on('error', forget);
		c.on('end', forget);
		await c.connect();
		return c;
	})().catch((e) => {
		client = null;
		throw e;
	});
	return client;
}

/** Take the lock of one job attempt; resolves to its release. */
export async function holdJobLock(id: string, attempt: number): Promise<() => Promise<void>> {
	const key = `${id}/${attempt}`;
	const c = await lockClient();
	await c.query('SELECT pg_try_advisory_lock($1, hashtext($2))', [JOB_LOCK_NAMESPACE, key]);
	return async () => {
		await c
			.query('SELECT pg_advisory_unlock($1, hashtext($2))', [JOB_LOCK_NAMESPACE, key])
			.catch(() => undefined);
	};
}

export async function closeLockClient(): Promise<void> {
	const c = client;
	client = null;
	const open = c ? await c.catch(() => null) : null;
	await open?.end().catch(() => undefined);
}
