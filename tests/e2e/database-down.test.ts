// The database goes away under a running server and comes back (issue 14: with PostgreSQL
// stopped, 21 of 21 database-backed routes answered 500). A second app process reaches
// PostgreSQL through a TCP relay this test owns; closing the relay is the outage (new
// connections refused, open ones cut), reopening it the recovery. Every kind of request must
// answer 503 with Retry-After and say the service is briefly unavailable — JSON for the API,
// a page for the browser — and work again by itself afterwards.
import { expect, test, type APIResponse, type Page } from '@playwright/test';
import { spawn, type ChildProcess } from 'node:child_process';
import net from 'node:net';

let relay: net.Server | null = null;
const open = new Set<net.Socket>();
let app: ChildProcess | null = null;
let base = '';
let relayPort = 0;
let log = '';

const freePort = () =>
	new Promise<number>((resolve) => {
		const s = net.createServer().listen(0, '127.0.0.1', () => {
			const { port } = s.address() as net.AddressInfo;
			s.close(() => resolve(port));
		});
	});

function startRelay(target: URL, port: number) {
	relay = net.createServer((client) => {
		const upstream = net.connect(Number(target.port || 5432), target.hostname);
		for (const s of [client, upstream]) {
			open.add(s);
			s.on('close', () => open.delete(s));
			s.on('error', () => s.destroy());
		}
		client.pipe(upstream).pipe(client);
	});
	return new Promise<void>((resolve) => relay!.listen(port, '127.0.0.1', resolve));
}

async function stopRelay() {
	const closed = new Promise<void>((resolve) => relay!.close(() => resolve()));
	for (const s of open) s.destroy();
	await closed;
	relay = null;
}

test.beforeAll(async () => {
	const target = new URL(process.env.DATABASE_URL!);
	relayPort = await freePort();
	await startRelay(target, relayPort);
	const viaRelay = new URL(target);
	viaRelay.port = String(relayPort);
	const port = await freePort();
	base = `http://127.0.0.1:${port}`;
	app = spawn(process.execPath, [process.env.POLEWISE_SERVE_DIR ?? 'build'], {
		env: {
			...process.env,
			DATABASE_URL: viaRelay.toString(),
			PORT: String(port),
			HOST: '127.0.0.1',
			ORIGIN: base,
			POLEWISE_ROLE: 'web'
		},
		stdio: ['ignore', 'ignore', 'pipe']
	});
	// Read what it logs (an unread pipe would fill and block the server), keep the tail.
	app.stderr!.on('data', (chunk) => (log = (log + chunk).slice(-4000)));
	await expect
		.poll(async () => (await fetch(`${base}/api/health`).catch(() => null))?.status, {
			timeout: 30_000
		})
		.toBe(200);
});

test.afterEach(async ({ page: _page }, info) => {
	if (info.status !== info.expectedStatus) console.log(`second server's log:\n${log}`);
});

test.afterAll(async () => {
	app?.kill('SIGTERM');
	if (relay) await stopRelay();
});

async function signIn(page: Page) {
	await page.goto(`${base}/sign-in`);
	await page.getByLabel('E-mail address').fill('reviewer@polewise.test');
	await page.getByLabel('Password').fill('polewise-review');
	await page.getByRole('button', { name: 'Sign in' }).click();
	await expect(page).toHaveURL(/\/workspaces/);
}

async function expectUnavailableJson(response: APIResponse) {
	expect(response.status(), response.url()).toBe(503);
	expect(Number(response.headers()['retry-after'])).toBeGreaterThan(0);
	const body = await response.json();
	expect(body).toMatchObject({ code: 'unavailable' });
	expect(body.error).toMatch(/briefly unavailable/);
}

test('database gone: every kind of request answers 503 with Retry-After; back: it works again by itself', async ({
	page,
	browser
}) => {
	await signIn(page);
	await page.goto(`${base}/account`);
	await page.getByLabel('New token name').fill(`outage probe ${Date.now()}`);
	await page.getByRole('button', { name: 'Create token' }).click();
	const token = (await page.getByTestId('new-token').textContent())!.trim();
	const auth = { authorization: `Bearer ${token}` };
	const api = page.request;
	const { workspaces } = await (await api.get(`${base}/api/workspaces`, { headers: auth })).json();
	const { sheets } = await (
		await api.get(`${base}/api/workspaces/${workspaces[0].id}/sheets`, { headers: auth })
	).json();
	const sheet = sheets[0];
	const sheetPage = `${base}/sheets/${sheet.id}`;
	expect((await page.goto(sheetPage))!.status()).toBe(200);

	await stopRelay();

	// API: by token, by cookie, a save, a comment, a stored revision's analysis and export.
	await expectUnavailableJson(await api.get(`${base}/api/workspaces`, { headers: auth }));
	await expectUnavailableJson(await api.get(`${base}/api/sheets/${sheet.id}`));
	await expectUnavailableJson(
		await api.put(`${base}/api/sheets/${sheet.id}/revisions`, {
			data: { baseRevision: 1, document: {} }
		})
	);
	await expectUnavailableJson(
		await api.post(`${base}/api/sheets/${sheet.id}/comments`, { data: { body: 'still there?' } })
	);
	await expectUnavailableJson(
		await api.get(`${base}/api/sheets/${sheet.id}/revisions/1/analysis`, { headers: auth })
	);
	await expectUnavailableJson(
		await api.get(`${base}/api/sheets/${sheet.id}/export/poles.csv`, { headers: auth })
	);
	// A junk token is looked up before anything else: unavailable too, not 401 or 500.
	await expectUnavailableJson(
		await api.get(`${base}/api/workspaces`, { headers: { authorization: 'Bearer pw_junk' } })
	);
	const health = await api.get(`${base}/api/health`);
	expect(health.status()).toBe(503);

	// The browser: the sheet page is a page of its own that says so and retries by itself.
	const down = await page.goto(sheetPage);
	expect(down!.status()).toBe(503);
	expect(Number(down!.headers()['retry-after'])).toBeGreaterThan(0);
	await expect(page.getByRole('heading', { name: 'Briefly unavailable' })).toBeVisible();
	await expect(page.getByText('its database is not answering')).toBeVisible();
	await page.screenshot({ path: 'test-results/database-down.png' });

	// Signing in (a form action) is refused the same way, not with a 500.
	const visitor = await (await browser.newContext()).newPage();
	await visitor.goto(`${base}/sign-in`);
	await visitor.getByLabel('E-mail address').fill('reviewer@polewise.test');
	await visitor.getByLabel('Password').fill('polewise-review');
	const [answer] = await Promise.all([
		visitor.waitForResponse((r) => r.url().includes('/sign-in') && r.request().method() === 'POST'),
		visitor.getByRole('button', { name: 'Sign in' }).click()
	]);
	expect(answer.status()).toBe(503);
	expect(answer.headers()['retry-after']).toMatch(/^\d+$/);

	await startRelay(new URL(process.env.DATABASE_URL!), relayPort);

	// Recovery needs nothing: the next requests find the database again.
	await expect
		.poll(async () => (await api.get(`${base}/api/workspaces`, { headers: auth })).status(), {
			timeout: 20_000
		})
		.toBe(200);
	expect((await page.goto(sheetPage))!.status()).toBe(200);
	await expect(page.getByRole('heading', { level: 1, name: sheet.name })).toBeVisible();
});
