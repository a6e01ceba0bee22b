// The tolerance-run queue's runner, started the way the server hook starts it when the app
// process starts: a job queued while no process takes jobs waits in PostgreSQL, and is picked
// up once the runner starts; a start that fails is logged, not thrown, and the next start works.
import { afterAll, describe, expect, it, vi } from 'vitest';
import { useDatabase } from './support/database';
import { dividerSheet } from './design-helpers';
import { createDesignJob, getDesignJob } from '../../src/lib/server/db/design-jobs';
import { closeDesignPool } from '../../src/lib/server/jobs/design-pool';
import { enqueueDesignJob } from '../../src/lib/server/jobs/design-queue';
import { startJobRunnerAtBoot, stopJobRunner } from '../../src/lib/server/jobs/all-kinds';

useDatabase();
afterAll(async () => {
	await stopJobRunner();
	await closeDesignPool();
});

const sleep = (ms: number) => new Promise((ok) => setTimeout(ok, ms));

/** The job once it is done or failed (or as it stands after a minute). */
async function finished(id: string) {
	const end = Date.now() + 60_000;
	let job = await getDesignJob(id);
	while (job && job.state !== 'done' && job.state !== 'failed' && Date.now() < end) {
		await sleep(200);
		job = await getDesignJob(id);
	}
	return job;
}

async function queuedJob() {
	const { ana, sheet } = await dividerSheet();
	const request = {
		tolerances: [{ element: 'Ctop', tolerance: 0.1, distribution: 'uniform' as const }],
		runs: 300,
		seed: 4,
		spec: {}
	};
	const job = await createDesignJob({
		sheetId: sheet.id,
		revision: 1,
		kind: 'monte-carlo',
		request: { request },
		total: request.runs,
		createdBy: ana.id
	});
	// Sending only connects to pg-boss; it does not subscribe this process to the queue.
	await enqueueDesignJob(job.id);
	return job.id;
}

describe('design job runner', () => {
	it('a job queued while no runner is started waits, and runs once the runner starts', async () => {
		const id = await queuedJob();
		// Four polling intervals of a runner (0.5 s each): a subscribed process would have taken it.
		await sleep(2000);
		expect(await getDesignJob(id)).toMatchObject({ state: 'queued', done: 0 });
		// Started twice (the hook, then a design request): one subscription, no error.
		await Promise.all([startJobRunnerAtBoot(), startJobRunnerAtBoot()]);
		const job = await finished(id);
		expect(job).toMatchObject({ state: 'done', done: 300 });
		expect((job!.result as { runs: number; revision: number }).runs).toBe(300);
		expect((job!.result as { revision: number }).revision).toBe(1);
	}, 90_000);

	it('the server hook’s init starts the runner (what `node build` and the dev server call)', async () => {
		await stopJobRunner();
		const id = await queuedJob();
		const { init } = await import('../../src/hooks.server');
		await init();
		const job = await finished(id);
		expect(job?.state).toBe('done');
	}, 90_000);

	it('a runner that cannot reach the database logs why and does not throw; a later start works', async () => {
		await stopJobRunner();
		const saved = process.env.DATABASE_URL!;
		const logged = vi.spyOn(console, 'error').mockImplementation(() => {});
		// Port 1 on the loopback refuses at once: nothing listens there.
		const url = new URL(saved);
		url.port = '1';
		process.env.DATABASE_URL = url.toString();
		let said = '';
		try {
			await expect(startJobRunnerAtBoot()).resolves.toBeUndefined();
			said = logged.mock.calls.flat().join(' ');
		} finally {
			process.env.DATABASE_URL = saved;
			logged.mockRestore();
		}
		expect(said).toMatch(/the runner did not start/);
		const id = await queuedJob();
		await startJobRunnerAtBoot();
		const job = await finished(id);
		expect(job?.state).toBe('done');
	}, 90_000);
});
