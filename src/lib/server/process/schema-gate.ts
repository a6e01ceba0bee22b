// Before an app process serves or takes jobs: is the database's schema the one this code needs?
// A deployment may start new processes while the migrator is still running, so a process waits
// (POLEWISE_SCHEMA_WAIT_SECONDS, default 60) and says what it waits for; then it refuses to
// start, with the command that fixes it. A schema newer than the code (an older release started
// after a newer one migrated) is allowed with a warning: migrations only add.
import { schemaState } from '../db/schema-version';

const sleep = (ms: number) => new Promise((ok) => setTimeout(ok, ms));

export class SchemaRefusal extends Error {}

export async function awaitSchema(
	waitSeconds: number,
	log: (line: string) => void = console.log
): Promise<void> {
	const deadline = Date.now() + waitSeconds * 1000;
	let said = '';
	for (;;) {
		let problem: string;
		try {
			const { pending, unknown } = await schemaState();
			if (unknown.length) {
				log(
					`polewise: the database has migrations this code does not know (${unknown.join(', ')}): a newer release migrated it; starting anyway`
				);
			}
			if (pending.length === 0) return;
			problem = `the database schema is older than this code: ${pending.length} migration(s) not applied (${pending.join(', ')}). Run the migrate command first: node build/migrate.js (same DATABASE_URL)`;
		} catch (e) {
			problem = `cannot read the schema version from the database: ${e instanceof Error ? e.message : String(e)}`;
		}
		if (Date.now() >= deadline) throw new SchemaRefusal(problem);
		if (problem !== said) log(`polewise: waiting up to ${waitSeconds} s: ${problem}`);
		said = problem;
		await sleep(Math.min(2000, Math.max(0, deadline - Date.now())));
	}
}
