// A worker process (POLEWISE_ROLE=worker): takes queued jobs and serves no HTTP. It keeps trying
// to subscribe while the database is unreachable, and on SIGTERM/SIGINT (systemd stop, Ctrl-C)
// stops taking jobs and hands back the one it is running, so another worker continues it.
import { closeDb } from '../db/connection';
import { closeDesignPool } from '../jobs/design-pool';
import { startJobRunner, stopJobRunner } from '../jobs/all-kinds';

const sleep = (ms: number) => new Promise((ok) => setTimeout(ok, ms));

export async function runWorker(): Promise<void> {
	let stopping = false;
	const stop = async (signal: string) => {
		if (stopping) return;
		stopping = true;
		console.log(`polewise worker: ${signal}: stopping`);
		await stopJobRunner().catch(() => undefined);
		await closeDesignPool().catch(() => undefined);
		await closeDb().catch(() => undefined);
		process.exit(0);
	};
	process.once('SIGTERM', () => void stop('SIGTERM'));
	process.once('SIGINT', () => void stop('SIGINT'));

	for (let wait = 1000; !stopping; wait = Math.min(wait * 2, 30_000)) {
		try {
			await startJobRunner();
			console.log('polewise worker: taking jobs');
			return;
		} catch (e) {
			console.error(
				`polewise worker: cannot take jobs yet (${e instanceof Error ? e.message : e}); trying again in ${wait / 1000} s`
			);
			await sleep(wait);
		}
	}
}
