// The built server runs analyses in its bundled worker (build/workers/analyze.worker.mjs).
import { expect, test } from '@playwright/test';
import { readFileSync } from 'node:fs';

const probe = JSON.parse(readFileSync('docs/examples/probe-10x.json', 'utf8'));

test('a signed-in designer posts a network and gets its poles from the worker pool', async ({ page }) => {
	const anonymous = await page.request.post('/api/analyze', { data: probe });
	expect(anonymous.status()).toBe(401);

	await page.goto('/sign-in');
	await page.getByLabel('E-mail address').fill('demo@polewise.test');
	await page.getByLabel('Password').fill('polewise-demo');
	await page.getByRole('button', { name: /sign in/i }).click();
	await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));

	const response = await page.request.post('/api/analyze?points=20', { data: probe });
	expect(response.status()).toBe(200);
	const analysis = await response.json();
	// 10:1 probe, common practice: natural frequencies near 1768 Hz and 353.7 MHz.
	expect(analysis.poles.map((p: { hz: number }) => Number(p.hz.toPrecision(4)))).toEqual([1768, 3.537e8]);
	expect(analysis.frequencyResponse.f).toHaveLength(20);
});
