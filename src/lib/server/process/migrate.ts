// The deployment's migrate command, run from the build: `node build/migrate.js` (no dev
// dependencies, no demo data). It holds a PostgreSQL advisory lock while it works, so two
// migrators started together (two machines deploying at once) are safe: the second waits, then
// finds nothing to do. Exit 0 when the schema is up to date afterwards, 1 with the reason
// otherwise, 78 (EX_CONFIG) for a bad setting.
import { config, ConfigError } from '../config';
import { closeDb } from '../db/connection';
import { migrateUp } from '../db/migrate';
import { latestMigration } from '../db/schema-version';

async function main(): Promise<number> {
	try {
		if (!config().databaseUrl)
			throw new ConfigError([
				{ variable: 'DATABASE_URL', message: 'is not set: name the database to migrate' }
			]);
	} catch (e) {
		if (!(e instanceof ConfigError)) throw e;
		console.error(`polewise migrate: a setting is wrong:\n  ${e.message.replaceAll('\n', '\n  ')}`);
		return 78;
	}
	try {
		const applied = await migrateUp({
			onWait: () =>
				console.log('polewise migrate: another migrator holds the lock; waiting for it to finish')
		});
		console.log(
			applied.length
				? `polewise migrate: applied ${applied.join(', ')}; the schema is at ${latestMigration()}`
				: `polewise migrate: nothing to do; the schema is at ${latestMigration()}`
		);
		return 0;
	} catch (e) {
		console.error(`polewise migrate: failed: ${e instanceof Error ? e.message : String(e)}`);
		return 1;
	} finally {
		await closeDb().catch(() => undefined);
	}
}

process.exitCode = await main();
