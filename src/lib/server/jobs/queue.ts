// The job queue on PostgreSQL: pg-boss (v10, the line that runs on Node 20) in its own schema
// hands each entry to exactly one worker with SELECT … FOR UPDATE SKIP LOCKED, so processes on
// any number of machines share one queue safely. One pg-boss instance per process, for every
// job kind; connecting is enough to send and cancel, subscribing is the runner's business.
import PgBoss from 'pg-boss';
import { databaseUrl } from '../db/connection';

let connecting: Promise<PgBoss> | null = null;
const created = new Set<string>();

/** pg-boss started (its schema installed or migrated by the first process to get there). */
export function jobBoss(): Promise<PgBoss> {
	connecting ??= (async () => {
		// max 3: the connection budget in the README counts these per process.
		const boss = new PgBoss({ connectionString: databaseUrl(), max: 3 });
		boss.on('error', (e) => console.error(`job queue: ${e.message}`));
		await boss.start();
		return boss;
	})().catch((e) => {
		connecting = null;
		throw e;
	});
	return connecting;
}

/** The queue of one job kind, created on first use (by whichever process comes first). */
export async function queueFor(name: string): Promise<PgBoss> {
	const boss = await jobBoss();
	if (!created.has(name)) {
		if (!(await boss.getQueue(name))) {
			try {
				await boss.createQueue(name);
			} catch {
				// Another process created it between the check and here.
			}
		}
		created.add(name);
	}
	return boss;
}

export async function stopBoss(): Promise<void> {
	const c = connecting;
	connecting = null;
	created.clear();
	const boss = c ? await c.catch(() => null) : null;
	if (boss) await boss.stop({ graceful: true, wait: true, timeout: 5000 });
}
