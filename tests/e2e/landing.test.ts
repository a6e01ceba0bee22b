import { expect, test } from '@playwright/test';

test('the landing page says what Polewise is and carries the safety caution', async ({ page }) => {
	await page.goto('/');
	await expect(page).toHaveTitle(/Polewise/);
	await expect(page.getByRole('heading', { level: 1 })).toHaveText('Know which part sets each pole.');
	await expect(page.getByRole('complementary', { name: 'Safety caution' })).toContainText('IEC 61010');
});

test('the theme switch changes the page to dark and the choice survives a reload', async ({ page }) => {
	await page.goto('/');
	await page.getByRole('button', { name: 'Switch to dark theme' }).click();
	await expect(page.locator('html')).toHaveAttribute('data-theme', 'dark');
	await page.reload();
	await expect(page.locator('html')).toHaveAttribute('data-theme', 'dark');
	await expect(page.getByRole('button', { name: 'Switch to light theme' })).toBeVisible();
});

test('the health route reports the version and a database that answers', async ({ request }) => {
	const response = await request.get('/api/health');
	expect(response.status()).toBe(200);
	const body = await response.json();
	expect(body).toMatchObject({ service: 'polewise', database: 'ok' });
	expect(body.version).toMatch(/^\d+\.\d+\.\d+$/);
});
