// A wrong value shows an inline error and the analysis is not run with it; fixing it resumes.
import { expect, test } from '@playwright/test';
import { analysis, newSheet, node, openSheet, signUpFresh, RC_LOW_PASS } from './editor-helpers';

const RC = RC_LOW_PASS;

test('10pp is refused inline and never reaches the analysis', async ({ page }) => {
	test.setTimeout(60_000);
	await signUpFresh(page);
	await openSheet(page, await newSheet(page, RC, 'Bad value'));
	await expect(analysis(page)).toHaveAttribute('data-analysis-status', 'done');
	const posted: string[] = [];
	page.on('request', (r) => {
		if (r.url().includes('/api/analyze') && r.method() === 'POST') posted.push(r.postData() ?? '');
	});

	await node(page, 'C1').click();
	const value = page.getByRole('region', { name: 'Properties' }).getByLabel(/Capacitance/);
	await value.fill('10pp');
	await expect(value).toHaveAttribute('aria-invalid', 'true');
	await expect(page.getByRole('region', { name: 'Properties' })).toContainText(
		'is not a number with an SI prefix'
	);
	await expect(analysis(page)).toHaveAttribute('data-analysis-status', 'blocked');
	await expect(analysis(page)).toContainText('C1:');
	await expect(node(page, 'C1')).toContainText('⚠');
	await page.waitForTimeout(600);
	expect(posted).toEqual([]);

	// One-pole RC (closed form): corner 1/(2πRC) with R = 1 kΩ, C = 10 pF → 15.915 MHz.
	await value.fill('10p');
	await expect(analysis(page)).toHaveAttribute('data-analysis-status', 'done');
	expect(posted).toHaveLength(1);
	expect(JSON.parse(posted[0]).elements.find((e: { id: string }) => e.id === 'C1').value).toBe(
		'10p'
	);
	const hz = Number(
		await page
			.getByRole('table', { name: 'Poles' })
			.getByTestId('pole-hz')
			.first()
			.getAttribute('data-hz')
	);
	expect(Math.abs(hz - 1 / (2 * Math.PI * 1e3 * 10e-12)) / hz).toBeLessThan(1e-6);
});
