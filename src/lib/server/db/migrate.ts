// Versioned migrations with umzug; the applied names live in the `schema_migrations` table.
// Every run holds a PostgreSQL advisory lock: when two migrators start together (two machines
// deploying at once), the second waits for the first, then finds nothing to do.
import { Umzug, SequelizeStorage } from 'umzug';
import { db } from './connection';
import { migrations } from './migrations';
import { LOCKS, withAdvisoryLock } from './advisory-lock';

function migrator() {
	const sequelize = db();
	return new Umzug({
		migrations,
		context: sequelize.getQueryInterface(),
		storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
		logger: undefined
	});
}

export interface MigrateOptions {
	/** Called once when another migrator holds the lock and this one starts waiting. */
	onWait?: () => void;
}

/** Apply every pending migration; returns the names applied now (none when up to date). */
export async function migrateUp(options: MigrateOptions = {}): Promise<string[]> {
	return withAdvisoryLock(
		LOCKS.migrate,
		async () => (await migrator().up()).map((m) => m.name),
		options.onWait
	);
}

/** Undo every migration (tests and `tsx scripts/db.ts reset` only). */
export async function migrateDownAll(): Promise<void> {
	await withAdvisoryLock(LOCKS.migrate, async () => void (await migrator().down({ to: 0 })));
}
