// A PostgreSQL advisory lock held on a connection of its own for the length of a piece of work:
// the mutex between processes (on any machine) that share one database. PostgreSQL releases it
// when that connection ends, so a process that dies mid-work never leaves it held.
import pg from 'pg';
import { databaseUrl } from './connection';

/** Lock keys in use (any 64-bit numbers; fixed so every process agrees). */
export const LOCKS = {
	migrate: 7_319_001,
	seed: 7_319_002
} as const;

export async function withAdvisoryLock<T>(
	key: number,
	work: () => Promise<T>,
	onWait?: () => void
): Promise<T> {
	const client = new pg.Client({ connectionString: databaseUrl() });
	await client.connect();
	try {
		const { rows } = await client.query('SELECT pg_try_advisory_lock($1) AS got', [key]);
		if (!rows[0].got) {
			onWait?.();
			await client.query('SELECT pg_advisory_lock($1)', [key]);
		}
		return await work();
	} finally {
		// Ending the connection releases the lock even if the unlock itself fails.
		await client.query('SELECT pg_advisory_unlock($1)', [key]).catch(() => undefined);
		await client.end().catch(() => undefined);
	}
}
