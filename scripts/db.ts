// Database chores, run under tsx by the bootstrap and by hand:
//   tsx scripts/db.ts migrate   apply pending migrations (as `node build/migrate.js` does)
//   tsx scripts/db.ts seed      add the demo workspace (once)
//   tsx scripts/db.ts setup     both (what `npm start` does on its local cluster only)
//   tsx scripts/db.ts reset     drop everything and migrate again (tests)
// Migrating holds an advisory lock, and so does seeding: two of these at once are safe.
import { closeDb } from '../src/lib/server/db/connection';
import { migrateDownAll, migrateUp } from '../src/lib/server/db/migrate';
import { LOCKS, withAdvisoryLock } from '../src/lib/server/db/advisory-lock';
import { seedDemo } from '../src/lib/server/db/seed';

const command = process.argv[2];

async function main() {
	if (command === 'reset') await migrateDownAll();
	if (['migrate', 'setup', 'reset'].includes(command)) {
		const applied = await migrateUp({ onWait: () => console.log('  another migrator is running; waiting for it') });
		console.log(applied.length ? `  applied migrations: ${applied.join(', ')}` : '  database schema is up to date');
	}
	if (['seed', 'setup'].includes(command)) {
		const { created } = await withAdvisoryLock(LOCKS.seed, seedDemo);
		console.log(created ? '  seeded the demo workspace' : '  demo workspace already present');
	}
	if (!['migrate', 'seed', 'setup', 'reset'].includes(command)) {
		throw new Error('usage: tsx scripts/db.ts migrate|seed|setup|reset');
	}
}

main()
	.then(() => closeDb())
	.catch(async (error) => {
		console.error(`database ${command} failed: ${error.message}`);
		await closeDb();
		process.exit(1);
	});
