// Integration tests share the throwaway database that `npm test` starts (DATABASE_URL).
// Each file migrates once and empties the tables before each test.
import { afterAll, beforeAll, beforeEach } from 'vitest';
import { closeDb, db } from '../../../src/lib/server/db/connection';
import { migrateUp } from '../../../src/lib/server/db/migrate';

export async function truncateAll() {
	const [rows] = await db().query(
		`SELECT tablename FROM pg_tables WHERE schemaname = 'public' AND tablename <> 'schema_migrations'`
	);
	const tables = (rows as { tablename: string }[]).map((r) => `"${r.tablename}"`);
	if (tables.length) await db().query(`TRUNCATE ${tables.join(', ')} RESTART IDENTITY CASCADE`);
}

export function useDatabase() {
	beforeAll(async () => {
		if (!process.env.DATABASE_URL) throw new Error('integration tests need DATABASE_URL: run them through `npm test`');
		await migrateUp();
	});
	beforeEach(truncateAll);
	afterAll(closeDb);
}
