// Security headers on every answer, and the app still works under its Content-Security-Policy
// (issue 14: there was no CSP, no frame-ancestors, no Referrer-Policy, nosniff only on
// downloads). The browser part drives the canvas, the plots, an upload, a live update and the
// report while recording every CSP violation the page reports; there must be none — and an
// injected inline script must be refused, which shows the recorder and the policy work.
import { expect, test, type BrowserContext, type Page } from '@playwright/test';
import { lowPass, lowPassCsv, sheetWith, signInAs } from './exchange-support';
import { artifact } from './artifacts';

const violations: string[] = [];

async function recordViolations(context: BrowserContext) {
	await context.exposeFunction('__cspViolation', (v: string) => violations.push(v));
	await context.addInitScript(() => {
		document.addEventListener('securitypolicyviolation', (e) =>
			(window as unknown as { __cspViolation: (v: string) => void }).__cspViolation(
				`${e.violatedDirective} blocked ${e.blockedURI || 'inline'} on ${location.pathname}`
			)
		);
	});
}

function expectHeaders(headers: Record<string, string>, what: string) {
	expect(headers['x-content-type-options'], what).toBe('nosniff');
	expect(headers['referrer-policy'], what).toBe('strict-origin-when-cross-origin');
	expect(headers['permissions-policy'], what).toMatch(/camera=\(\)/);
	expect(headers['x-frame-options'], what).toBe('DENY');
	expect(headers['content-security-policy'], what).toMatch(/frame-ancestors 'none'/);
}

test('every kind of answer carries the security headers; pages a nonce-based script policy', async ({
	request
}) => {
	for (const path of ['/', '/sign-in', '/sign-up', '/workspaces']) {
		const r = await request.get(path, { maxRedirects: 0 });
		expectHeaders(r.headers(), path);
	}
	const page = await request.get('/sign-in');
	const csp = page.headers()['content-security-policy'];
	const script = /script-src ([^;]+)/.exec(csp)![1];
	expect(script).toMatch(/'self' 'nonce-[A-Za-z0-9+/=]+'/);
	expect(script).not.toContain('unsafe-inline');
	expect(script).not.toContain('unsafe-eval');
	expect(csp).toMatch(/object-src 'none'/);
	// The nonce in the header is the one on the page's own script, and it changes per answer.
	const nonce = /'nonce-([^']+)'/.exec(script)![1];
	expect(await page.text()).toContain(`nonce="${nonce}"`);
	const again = (await request.get('/sign-in')).headers()['content-security-policy'];
	expect(again).not.toContain(nonce);

	for (const [path, status] of [
		['/api/health', 200],
		['/api/workspaces', 401],
		['/api/no-such-thing', 404],
		['/api/sheets/not-an-id', 400]
	] as const) {
		const r = await request.get(path);
		expect(r.status(), path).toBe(status);
		expectHeaders(r.headers(), path);
		expect(r.headers()['content-security-policy'], path).toMatch(/^default-src 'none'/);
	}
});

test('canvas, plots, an upload, a live update and the report all work under the policy', async ({
	browser
}) => {
	test.setTimeout(120_000);
	violations.length = 0;
	const ctxA = await browser.newContext({ viewport: { width: 1400, height: 1000 } });
	const ctxB = await browser.newContext({ viewport: { width: 1400, height: 1000 } });
	await recordViolations(ctxA);
	await recordViolations(ctxB);
	const a = await ctxA.newPage();
	const b = await ctxB.newPage();
	await signInAs(a);
	await signInAs(b);
	const { sheetId } = await sheetWith(a, lowPass, 'RC low-pass under CSP');

	await a.goto(`/sheets/${sheetId}`);
	// Canvas: the parts are drawn and can be selected.
	await expect(a.locator('.svelte-flow__node').first()).toBeVisible();
	expect(await a.locator('.svelte-flow__node').count()).toBeGreaterThanOrEqual(3);
	// Plots: the response curve is drawn.
	const plot = a.locator('figure', { has: a.getByRole('img', { name: /Frequency response/ }) });
	await expect(plot.locator('path[d^="M"]').first()).toBeVisible();

	// Upload: a measured response, previewed and stored, overlaid on the plot.
	const measured = a.getByRole('region', { name: 'Measured responses' });
	await measured
		.getByLabel(/Measured response \(CSV/)
		.setInputFiles({ name: 'csp.csv', mimeType: 'text/csv', buffer: Buffer.from(lowPassCsv(0.5)) });
	await measured.getByLabel('Name').fill('CSP sweep');
	await measured.getByRole('button', { name: 'Store measurement' }).click();
	await expect(measured.getByText('“CSP sweep” stored: 31 points.')).toBeVisible();
	await expect(plot.getByText('measured: CSP sweep')).toBeVisible();

	// Live update: B comments, A sees it without a reload (server-sent events).
	const review = (p: Page) => p.getByRole('region', { name: 'Review' });
	await expect(review(a).getByTestId('live-status')).toHaveText(/live/);
	await b.goto(`/sheets/${sheetId}`);
	await review(b)
		.getByLabel('Comment', { exact: true })
		.fill('Corner checked under the new policy.');
	await review(b).getByRole('button', { name: 'Post comment' }).click();
	await expect(review(a).getByText('Corner checked under the new policy.')).toBeVisible({
		timeout: 20_000
	});
	await a.screenshot({ path: artifact('csp-sheet.png'), fullPage: false });

	// The report.
	await a.goto(`/sheets/${sheetId}/report`);
	await expect(a.getByRole('heading', { level: 1, name: 'RC low-pass under CSP' })).toBeVisible();
	await expect(a.getByRole('table', { name: 'Poles' })).toBeVisible();

	expect(violations, 'CSP violations while using the app').toEqual([]);

	// And the policy bites: an inline script put into the page does not run, and is reported.
	const ran = await a.evaluate(async () => {
		const s = document.createElement('script');
		s.textContent = 'window.__injected = true';
		document.head.append(s);
		await new Promise((r) => setTimeout(r, 100));
		return (window as unknown as { __injected?: boolean }).__injected ?? false;
	});
	expect(ran).toBe(false);
	await expect.poll(() => violations.length).toBeGreaterThan(0);
	expect(violations[0]).toMatch(/^script-src/);
	await ctxA.close();
	await ctxB.close();
});
