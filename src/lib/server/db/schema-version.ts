// Is the database's schema the one this code was built for? Read without side effects (umzug's
// own `pending()` would create its table): an app process asks before it serves, and refuses
// (after waiting a while for a migrator) when migrations this code needs are missing.
import { db } from './connection';
import { migrations } from './migrations';

export interface SchemaState {
	/** Migrations this code has that the database has not applied, in order. */
	pending: string[];
	/** Migrations the database has that this code does not know (a newer release migrated it). */
	unknown: string[];
}

export async function schemaState(): Promise<SchemaState> {
	const [[exists]] = (await db().query(
		`SELECT to_regclass('public.schema_migrations') IS NOT NULL AS present`
	)) as [{ present: boolean }[], unknown];
	const applied = new Set<string>();
	if (exists.present) {
		const [rows] = await db().query('SELECT name FROM schema_migrations');
		for (const r of rows as { name: string }[]) applied.add(r.name);
	}
	const known = new Set(migrations.map((m) => m.name));
	return {
		pending: migrations.map((m) => m.name).filter((n) => !applied.has(n)),
		unknown: [...applied].filter((n) => !known.has(n)).sort()
	};
}

export const latestMigration = () => migrations[migrations.length - 1].name;
