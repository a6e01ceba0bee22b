// A bounded load on the built server over loopback, run by `npm run bench` (tagged @bench, not
// part of `npm test`): rising numbers of clients send analyses as fast as they are answered while
// a probe keeps opening the sheet page and /api/health, so the figures show what saturation does
// to everything else. Each step runs for a fixed time and then stops; nothing leaves loopback.
// Reports, per step: analyses answered per second, p50/p99 of the answered ones, how many were
// shed (503 busy, 429 share) or stopped, and the sheet page's and /api/health's p50/p99 beside
// them; and the step at which shedding starts. Writes bench-results/load.json; figures go into
// docs/performance.md with the machine's load (other engineers share this 2-core machine).
import { expect, test } from '@playwright/test';
import { mkdirSync, writeFileSync } from 'node:fs';
import { loadavg } from 'node:os';
import { createHash, randomBytes } from 'node:crypto';
import pg from 'pg';
import { spawn } from 'node:child_process';

const STEPS = (process.env.LOAD_STEPS ?? '0,1,2,4,8,16,32,64').split(',').map(Number);
const STEP_SECONDS = Number(process.env.LOAD_STEP_SECONDS ?? 8);
const SECTIONS = Number(process.env.LOAD_SECTIONS ?? 150);

/** The analysis every client sends: an RC ladder (dense path), answered as the editor asks. */
function ladder(n: number) {
	const elements: object[] = [{ id: 'V1', type: 'V', nodes: ['n0', 'gnd'], value: 1 }];
	for (let i = 1; i <= n; i++) {
		elements.push({ id: `R${i}`, type: 'R', nodes: [`n${i - 1}`, `n${i}`], value: 100 + i });
		elements.push({ id: `C${i}`, type: 'C', nodes: [`n${i}`, 'gnd'], value: `${1 + (i % 7)}n` });
	}
	return JSON.stringify({ schema: 1, elements, input: 'V1', output: { node: `n${n}` } });
}

const pct = (xs: number[], p: number) => {
	if (!xs.length) return null;
	const s = xs.slice().sort((a, b) => a - b);
	return Math.round(s[Math.min(s.length - 1, Math.ceil((p / 100) * s.length) - 1)] * 10) / 10;
};
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** The probe process: the sheet page (signed in) and /api/health in turn, every 100 ms. */
const PROBE = `
const { PROBE_BASE: base, PROBE_PAGE: page, PROBE_COOKIE: cookie, PROBE_UNTIL: until } = process.env;
const out = { page: [], health: [] };
while (Date.now() < Number(until)) {
	let t0 = performance.now();
	const p = await fetch(base + page, { headers: { cookie, accept: 'text/html' } });
	await p.text();
	if (p.status === 200) out.page.push(performance.now() - t0);
	t0 = performance.now();
	const h = await fetch(base + '/api/health');
	await h.text();
	if (h.status === 200) out.health.push(performance.now() - t0);
	await new Promise((r) => setTimeout(r, 100));
}
process.stdout.write(JSON.stringify(out));
`;

/** One person and one API token per client, so each client is its own caller (fair share). */
async function clientTokens(count: number): Promise<string[]> {
	const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
	await client.connect();
	const tokens: string[] = [];
	const run = randomBytes(4).toString('hex');
	for (let i = 0; i < count; i++) {
		const token = `pw_${randomBytes(20).toString('hex').slice(0, 32)}`;
		const { rows } = await client.query(
			`INSERT INTO users (id, email, name, password_hash, created_at, updated_at) VALUES (gen_random_uuid(), $1, $2, NULL, now(), now()) RETURNING id`,
			[`load-${run}-${i}@example.test`, `Load client ${i}`]
		);
		await client.query(
			`INSERT INTO api_tokens (id, user_id, name, token_hash, prefix, created_at) VALUES (gen_random_uuid(), $1, 'load bench', $2, $3, now())`,
			[rows[0].id, createHash('sha256').update(token).digest('hex'), token.slice(0, 9)]
		);
		tokens.push(token);
	}
	await client.end();
	return tokens;
}

test('server under a saturating analysis load', { tag: '@bench' }, async ({ page, baseURL }) => {
	test.setTimeout((STEPS.length * (STEP_SECONDS + 6) + 60) * 1000);
	const tokens = await clientTokens(Math.max(1, ...STEPS));
	// The probe is a signed-in browser session opening a real sheet page.
	await page.goto('/sign-in');
	await page.waitForLoadState('networkidle');
	await page.getByLabel('E-mail address').fill('demo@polewise.test');
	await page.getByLabel('Password').fill('polewise-demo');
	await page.getByRole('button', { name: 'Sign in' }).click();
	await page.waitForURL(/\/workspaces/);
	await page
		.getByRole('link', { name: /Kestrel Ridge/ })
		.first()
		.click();
	const sheetHref = await page.locator('a[href^="/sheets/"]').first().getAttribute('href');
	const cookie = (await page.context().cookies()).map((c) => `${c.name}=${c.value}`).join('; ');
	const body = ladder(SECTIONS);
	const analyzeUrl = `${baseURL}/api/analyze?omit=impedanceCurve,groupDelay,expansion&matrixPorts=12`;

	const results: Record<string, unknown>[] = [];
	const loadBefore = loadavg();
	for (const clients of STEPS) {
		const until = Date.now() + STEP_SECONDS * 1000;
		const ok: number[] = [];
		const counts = { busy: 0, share: 0, timeout: 0, other: 0 };
		const page_: number[] = [];
		const health: number[] = [];
		const worker = async (token: string) => {
			while (Date.now() < until) {
				const t0 = performance.now();
				const r = await fetch(analyzeUrl, {
					method: 'POST',
					body,
					headers: { 'content-type': 'application/json', authorization: `Bearer ${token}` }
				});
				const answer = await r.json().catch(() => ({}));
				const ms = performance.now() - t0;
				if (r.status === 200) ok.push(ms);
				else if (r.status === 503 && answer.code === 'busy') counts.busy++;
				else if (r.status === 429) counts.share++;
				else if (answer.code === 'timeout') counts.timeout++;
				else counts.other++;
				// A shed client waits as told (at most a second here, so the step keeps its load).
				if (r.status === 503 || r.status === 429)
					await sleep(Math.min(1000, Number(r.headers.get('retry-after') ?? 1) * 1000));
			}
		};
		// The probe runs in a process of its own, so the load clients' own event loop (up to 64
		// answers to handle here) never delays its timing: it measures the server, not this test.
		const probe = () =>
			new Promise<void>((resolve, reject) => {
				const child = spawn(process.execPath, ['--input-type=module', '-e', PROBE], {
					env: {
						...process.env,
						PROBE_BASE: baseURL!,
						PROBE_PAGE: sheetHref!,
						PROBE_COOKIE: cookie,
						PROBE_UNTIL: String(until)
					},
					stdio: ['ignore', 'pipe', 'inherit']
				});
				let out = '';
				child.stdout.on('data', (d) => (out += d));
				child.on('exit', () => {
					try {
						const r = JSON.parse(out);
						page_.push(...r.page);
						health.push(...r.health);
						resolve();
					} catch (e) {
						reject(e);
					}
				});
			});
		const started = Date.now();
		await Promise.all([...tokens.slice(0, clients).map(worker), probe()]);
		const seconds = (Date.now() - started) / 1000;
		const row = {
			clients,
			answered: ok.length,
			perSecond: Math.round((ok.length / seconds) * 10) / 10,
			analysisP50: pct(ok, 50),
			analysisP99: pct(ok, 99),
			shedBusy: counts.busy,
			shedShare: counts.share,
			timeouts: counts.timeout,
			other: counts.other,
			sheetP50: pct(page_, 50),
			sheetP99: pct(page_, 99),
			healthP50: pct(health, 50),
			healthP99: pct(health, 99),
			probes: page_.length,
			load1: Math.round(loadavg()[0] * 10) / 10
		};
		results.push(row);
		console.log(JSON.stringify(row));
		await sleep(3000); // let the queue drain between steps
	}
	const shedFrom =
		results.find((r) => (r.shedBusy as number) + (r.shedShare as number) > 0)?.clients ?? null;
	const report = {
		when: new Date().toISOString(),
		sections: SECTIONS,
		stepSeconds: STEP_SECONDS,
		loadBefore,
		loadAfter: loadavg(),
		shedFrom,
		steps: results
	};
	mkdirSync('bench-results', { recursive: true });
	writeFileSync('bench-results/load.json', JSON.stringify(report, null, 2));
	console.log(
		`shedding starts at ${shedFrom ?? 'no step'} clients; load before ${loadBefore.map((x) => x.toFixed(1)).join(' / ')}`
	);
	expect(results.length).toBe(STEPS.length);
	expect(results.every((r) => (r.other as number) === 0)).toBe(true);
});
