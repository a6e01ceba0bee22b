// What `node build` runs (build/package.json's "main"; bundled by scripts/build-entries.mjs).
// In order: check every setting (a bad one stops the process naming the variable, exit 78), hand
// the HTTP server the settings it reads as it loads (listen address, and a request-body limit
// that fits the upload limit), wait for the database schema this code needs, then start what
// POLEWISE_ROLE asks for: web (HTTP only), worker (queued jobs only, no HTTP) or all (both).
import { config, ConfigError } from '../config';
import { closeDb } from '../db/connection';
import { latestMigration } from '../db/schema-version';
import { awaitSchema, SchemaRefusal } from './schema-gate';

const EX_CONFIG = 78;

async function main() {
	let settings;
	try {
		settings = config();
		if (!settings.databaseUrl)
			throw new ConfigError([
				{
					variable: 'DATABASE_URL',
					message: 'is not set: every app process needs the database (postgres://…)'
				}
			]);
	} catch (e) {
		if (!(e instanceof ConfigError)) throw e;
		console.error(
			`polewise: cannot start, a setting is wrong:\n  ${e.message.replaceAll('\n', '\n  ')}`
		);
		process.exit(EX_CONFIG);
	}
	// adapter-node reads these when its handler loads; its own defaults (0.0.0.0, 512 KB) are
	// not Polewise's.
	process.env.HOST = settings.host;
	process.env.PORT = String(settings.port);
	process.env.BODY_SIZE_LIMIT = String(settings.bodySizeLimitBytes);

	try {
		await awaitSchema(settings.schemaWaitSeconds);
	} catch (e) {
		if (!(e instanceof SchemaRefusal)) throw e;
		console.error(`polewise: refusing to start: ${e.message}`);
		process.exit(1);
	} finally {
		await closeDb();
	}
	console.log(
		`polewise: ${settings.role} process ${process.pid}, schema at ${latestMigration()}` +
			(settings.role === 'worker'
				? ''
				: `, request bodies up to ${settings.bodySizeLimitBytes} bytes`)
	);
	if (settings.role === 'worker') await (await import('./worker')).runWorker();
	// The SvelteKit server; its hooks start the job runner too when the role is "all".
	else await import(new URL('./index.js', import.meta.url).href);
}

await main();
