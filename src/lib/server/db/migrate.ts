// Versioned migrations with umzug; the applied names live in the `schema_migrations` table.
import { Umzug, SequelizeStorage } from 'umzug';
import { db } from './connection';
import { migrations } from './migrations';

function migrator() {
	const sequelize = db();
	return new Umzug({
		migrations,
		context: sequelize.getQueryInterface(),
		storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
		logger: undefined
	});
}

/** Apply every pending migration; returns the names applied now. */
export async function migrateUp(): Promise<string[]> {
	const applied = await migrator().up();
	return applied.map((m) => m.name);
}

/** Undo every migration (tests and `npm run db:reset` only). */
export async function migrateDownAll(): Promise<void> {
	await migrator().down({ to: 0 });
}
