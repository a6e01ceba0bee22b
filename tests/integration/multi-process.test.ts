// Polewise as it runs on several machines, with real parts on loopback: Debian's nginx with the
// configuration of deploy/nginx in front of two web processes and a worker process, each started
// as its systemd unit in deploy/systemd says, on a fresh database migrated by two migrators at
// once. Checked through the balancer: sign-up/sign-in and saves on alternating processes, a live
// update crossing processes through the proxy, a 5 MB upload on each process, a Monte Carlo job
// that completes after its worker is killed with SIGKILL (a second worker takes it over), and
// cancel of a job whose worker is gone.
import { randomUUID } from 'node:crypto';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { digitizerDivider } from '../../src/lib/server/db/seed/demo-sheets';
import { inboxFor } from './support/auth-helpers';
import { latestMigration } from '../../src/lib/server/db/schema-version';
import {
	Client,
	freePort,
	startNginx,
	startUnit,
	stopProc,
	waitFor,
	type Proc
} from './support/cluster-of-processes';

const adminUrl = process.env.DATABASE_URL!;
const dbName = `polewise_mp_${randomUUID().slice(0, 8)}`;
const dbUrl = (() => {
	const u = new URL(adminUrl);
	u.pathname = `/${dbName}`;
	return u.toString();
})();

const procs: Proc[] = [];
let nginx: ReturnType<typeof startNginx> | null = null;
let origin = '';
let shared: Record<string, string> = {};
let webPorts: number[] = [];

async function admin(sql: string) {
	const c = new pg.Client({ connectionString: adminUrl });
	await c.connect();
	try {
		await c.query(sql);
	} finally {
		await c.end();
	}
}

function start(name: string, unit: string, instance = '', extra: Record<string, string> = {}) {
	const p = startUnit(name, unit, instance, { ...shared, ...extra });
	procs.push(p);
	return p;
}

const healthy = (port: number) => async () =>
	(await fetch(`http://127.0.0.1:${port}/api/health`)).ok;

beforeAll(async () => {
	await admin(`CREATE DATABASE ${dbName}`);
	const proxyPort = await freePort();
	origin = `http://127.0.0.1:${proxyPort}`;
	webPorts = [await freePort(), await freePort()];
	// Settings every process shares (README "Scaling out"); nothing else is set.
	shared = {
		DATABASE_URL: dbUrl,
		ORIGIN: origin,
		ADDRESS_HEADER: 'X-Forwarded-For',
		XFF_DEPTH: '1',
		DB_POOL_MAX: '4',
		ANALYSIS_THREADS: '1',
		// npm test's mail catcher: sign-up goes through a link sent by mail.
		SMTP_URL: process.env.SMTP_URL ?? '',
		POLEWISE_SIGNUPS_PER_HOUR: '50'
	};
}, 30_000);

afterAll(async () => {
	await Promise.all(procs.map((p) => stopProc(p)));
	if (nginx) {
		await stopProc(nginx.proc, 'SIGQUIT');
		nginx.cleanup();
	}
	await admin(`DROP DATABASE IF EXISTS ${dbName} WITH (FORCE)`);
}, 60_000);

describe('several processes behind nginx on one database', () => {
	it('a process refuses to start on a bad setting (exit 78, naming it) and on a schema older than its code (exit 1, naming the migrations)', async () => {
		const bad = start('web-bad', 'polewise-web@.service', String(webPorts[0]), {
			DB_POOL_MAX: 'lots'
		});
		expect(await bad.exited).toBe(78);
		expect(bad.output()).toContain('DB_POOL_MAX must be a whole number from 1 to 1000, not "lots"');
		const early = start('web-early', 'polewise-web@.service', String(webPorts[0]), {
			POLEWISE_SCHEMA_WAIT_SECONDS: '0'
		});
		expect(await early.exited).toBe(1);
		expect(early.output()).toMatch(
			/refusing to start: the database schema is older than this code: \d+ migration\(s\) not applied \(0001-accounts-and-sheets, .*\)\. Run the migrate command first: node build\/migrate\.js/
		);
	}, 60_000);

	it('a web process started before the migration waits for it; two migrators started together: one applies, the other waits and finds nothing to do; both exit 0', async () => {
		const web1 = start('web-1', 'polewise-web@.service', String(webPorts[0]));
		await waitFor('web-1 to say it waits for the schema', async () =>
			/waiting up to 60 s: the database schema is older than this code/.test(web1.output())
		);
		const a = start('migrate-a', 'polewise-migrate.service');
		const b = start('migrate-b', 'polewise-migrate.service');
		expect(await Promise.all([a.exited, b.exited])).toEqual([0, 0]);
		const said = [a.output(), b.output()];
		expect(said.filter((s) => /applied 0001-accounts-and-sheets/.test(s))).toHaveLength(1);
		expect(said.filter((s) => /nothing to do; the schema is at/.test(s))).toHaveLength(1);
		await waitFor('web-1 to serve once migrated', healthy(webPorts[0]));
	}, 90_000);

	it('web and worker processes start from their units; nginx answers for both web processes', async () => {
		start('web-2', 'polewise-web@.service', String(webPorts[1]));
		start('worker-a', 'polewise-worker@.service', 'a');
		nginx = startNginx(Number(new URL(origin).port), webPorts);
		for (const port of webPorts) await waitFor(`web process on ${port}`, healthy(port));
		await waitFor('nginx', healthy(Number(new URL(origin).port)));
		expect(procs.find((p) => p.name === 'web-1')!.output()).toMatch(
			new RegExp(
				`polewise: web process \\d+, schema at ${latestMigration()}, request bodies up to 6291456 bytes`
			)
		);
		// A worker serves no HTTP.
		await waitFor('the worker', async () =>
			/polewise worker: taking jobs/.test(procs.find((p) => p.name === 'worker-a')!.output())
		);
	}, 90_000);

	let user: Client;
	let sheetId = '';

	it('sign-up by mailed link, then the session and saves work on alternating web processes', async () => {
		user = new Client(origin);
		const email = `ines-${randomUUID().slice(0, 6)}@example.test`;
		const form = new URLSearchParams({
			name: 'Ines Marlow',
			email,
			password: 'two processes, one session'
		});
		const asked = await user.request('POST', '/sign-up', form);
		expect(asked.status).toBe(200);
		const [mail] = await inboxFor(email, { timeoutMs: 15_000 });
		const link = new URL(/https?:\/\/\S+\/sign-up\/[a-z0-9]+/.exec(mail.text)![0]);
		// The link's page and its button, each on whichever process the balancer picks.
		expect(link.origin).toBe(origin);
		const confirmed = await user.request('POST', link.pathname, new URLSearchParams());
		expect(confirmed.status).toBe(303);
		expect(user.cookie).toMatch(/^pw_session=/);
		const first = user.last;
		const seen = await user.json('GET', '/api/workspaces');
		expect(seen.status).toBe(200);
		// Round robin: the next request went to the other web process, which knows the session.
		expect(seen.upstream).not.toBe(first);
		expect(new Set(user.upstreams)).toEqual(new Set(webPorts.map((p) => `127.0.0.1:${p}`)));

		const ws = await user.json('POST', '/api/workspaces', { name: 'Bench 4 — two processes' });
		expect(ws.status).toBe(201);
		const created = await user.json('POST', `/api/workspaces/${ws.body.workspace.id}/sheets`, {
			name: 'Divider',
			document: digitizerDivider
		});
		expect(created.status).toBe(201);
		sheetId = created.body.sheet.id;
		const saves = [];
		for (const base of [1, 2]) {
			const doc = structuredClone(digitizerDivider) as {
				elements: { id: string; value: unknown }[];
			};
			doc.elements.find((e) => e.id === 'Ctop')!.value = base === 1 ? '6.2p' : '6.5p';
			saves.push(
				await user.json('PUT', `/api/sheets/${sheetId}/revisions`, {
					baseRevision: base,
					document: doc
				})
			);
		}
		expect(saves.map((s) => [s.status, s.body.revision.number])).toEqual([
			[201, 2],
			[201, 3]
		]);
		expect(saves[0].upstream).not.toBe(saves[1].upstream);
		// A save on a stale base is refused by whichever process gets it.
		const stale = await user.json('PUT', `/api/sheets/${sheetId}/revisions`, {
			baseRevision: 2,
			document: digitizerDivider
		});
		expect(stale.status).toBe(409);
		expect(stale.body.latest.number).toBe(3);
		// Twenty saves on the same base at once, spread over both processes: exactly one wins.
		const race = await Promise.all(
			Array.from({ length: 20 }, () =>
				user.json('PUT', `/api/sheets/${sheetId}/revisions`, {
					baseRevision: 3,
					document: digitizerDivider
				})
			)
		);
		expect(race.map((r) => r.status).sort()).toEqual([201, ...Array(19).fill(409)]);
		expect(new Set(race.map((r) => r.upstream)).size).toBe(2);
	}, 60_000);

	it('a live update published by one web process reaches a stream held by the other, through the proxy', async () => {
		const stream = await user.request('GET', `/api/sheets/${sheetId}/events`, undefined, {
			accept: 'text/event-stream'
		});
		expect(stream.status).toBe(200);
		expect(stream.headers.get('content-type')).toMatch(/^text\/event-stream/);
		const streamOn = user.last;
		const reader = stream.body!.getReader();
		let text = '';
		const arrived = (async () => {
			const decoder = new TextDecoder();
			while (!/"kind":"revision"[^\n]*"number":5/.test(text)) {
				const { value, done } = await reader.read();
				if (done) break;
				text += decoder.decode(value, { stream: true });
			}
			return text;
		})();
		// Make sure the save lands on the other process (round robin: the next request does,
		// unless something came in between).
		if (user.last !== streamOn) await user.request('GET', '/api/health');
		const save = await user.json('PUT', `/api/sheets/${sheetId}/revisions`, {
			baseRevision: 4,
			document: digitizerDivider
		});
		expect(save.status).toBe(201);
		expect(save.upstream).not.toBe(streamOn);
		// Unbuffered: the frame arrives at once, long before 20-second heartbeats could push it out.
		const timeout = new Promise<string>((_, reject) =>
			setTimeout(() => reject(new Error(`no revision event within 15 s; got: ${text}`)), 15_000)
		);
		expect(await Promise.race([arrived, timeout])).toMatch(/"kind":"revision"[^\n]*"number":5/);
		await reader.cancel();
	}, 30_000);

	it('a 5 MB upload is taken by each web process (the body limit follows the upload limit)', async () => {
		const pdf = Buffer.alloc(5 * 1024 * 1024, 0x20);
		pdf.write('%PDF-1.4\n');
		const upstreams = new Set<string>();
		for (let i = 0; i < 2; i++) {
			const form = new FormData();
			form.append('file', new Blob([pdf], { type: 'application/pdf' }), `bench-notes-${i}.pdf`);
			const r = await user.json('POST', `/api/sheets/${sheetId}/attachments`, form);
			expect(r.status).toBe(201);
			expect(r.body.attachment.byteSize).toBe(5 * 1024 * 1024);
			upstreams.add(r.upstream);
		}
		expect(upstreams.size).toBe(2);
	}, 60_000);

	const tolerance = {
		tolerances: [{ element: 'Ctop', tolerance: 0.1, distribution: 'uniform' }],
		seed: 3
	};
	const job = async (id: string) => (await user.json('GET', `/api/design/jobs/${id}`)).body.job;

	it('a Monte Carlo job completes after its worker is killed with SIGKILL: a second worker takes it over', async () => {
		const started = await user.json('POST', '/api/design/monte-carlo', {
			sheetId,
			runs: 4000,
			...tolerance
		});
		expect(started.status).toBe(202);
		const id = started.body.job.id;
		// Killed part-way, once some chunks of runs are done (and saved).
		const before = await waitFor(
			'the job to be part-way on worker a',
			async () => {
				const j = await job(id);
				return j.state === 'running' && j.done >= 500 ? j.done : null;
			},
			60_000
		);
		const a = procs.find((p) => p.name === 'worker-a')!;
		a.child.kill('SIGKILL');
		await a.exited;
		const killedAt = Date.now();
		start('worker-b', 'polewise-worker@.service', 'b');
		const taken = await waitFor(
			'a second worker to take it over',
			async () => {
				const j = await job(id);
				return j.attempt === 2 && ['running', 'done'].includes(j.state) ? j : null;
			},
			60_000
		);
		expect(Date.now() - killedAt).toBeLessThan(60_000);
		expect(taken.recovery).toMatch(
			/^attempt 1 stopped \(its process ended\) at [\d,]+ of 4,000; resumes where it stopped$/
		);
		const seen: number[] = [taken.done];
		const done = await waitFor(
			'the job to finish',
			async () => {
				const j = await job(id);
				seen.push(j.done);
				return ['done', 'failed', 'cancelled'].includes(j.state) ? j : null;
			},
			120_000
		);
		// It resumed after the saved runs: its progress never went back below where it was killed.
		expect(Math.min(...seen)).toBeGreaterThanOrEqual(before);
		expect(done).toMatchObject({ state: 'done', done: 4000, attempt: 2 });
		expect(done.result.runs).toBe(4000);
	}, 240_000);

	it('cancel ends a job whose worker is gone, with no worker left to do it', async () => {
		const started = await user.json('POST', '/api/design/monte-carlo', {
			sheetId,
			runs: 4000,
			...tolerance
		});
		const id = started.body.job.id;
		await waitFor(
			'the job to run on worker b',
			async () => (await job(id)).state === 'running',
			60_000
		);
		const b = procs.find((p) => p.name === 'worker-b')!;
		b.child.kill('SIGKILL');
		await b.exited;
		const cancelled = await user.json('POST', `/api/design/jobs/${id}/cancel`);
		expect(cancelled.status).toBe(200);
		// Ended at once, or (PostgreSQL still closing the dead worker's session) at the next look.
		expect(cancelled.body.job).toMatchObject({ cancelRequested: true });
		const ended = await waitFor('the cancel to end it', async () => {
			const j = await job(id);
			return j.state !== 'running' ? j : null;
		});
		expect(ended.state).toBe('cancelled');
		// Found by its worker's lock being gone, not by waiting out the heartbeat.
		expect(ended.recovery).toBe('cancelled; the worker running it had stopped (its process ended)');
		// And it stays ended, read through either web process.
		for (let i = 0; i < 2; i++) expect((await job(id)).state).toBe('cancelled');
	}, 120_000);
});
