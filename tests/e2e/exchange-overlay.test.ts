// Upload a measured response on the sheet page: preview with the guessed columns, store it, see
// it overlaid on the response plot with its legend entry and the deviation read-out. The file
// is the RC low-pass's closed-form magnitude plus 0.5 dB, so the deviation is 0.5 dB everywhere
// the model reaches (max and RMS); the model is the sheet's own analysis.
import { expect, test } from '@playwright/test';
import { signInAs, lowPass, lowPassCsv, sheetWith } from './exchange-support';
import { artifact } from './artifacts';

test('a measured response is previewed, stored, overlaid and compared with the model', async ({
	page
}) => {
	await signInAs(page);
	const { sheetId } = await sheetWith(page, lowPass, 'RC low-pass, bench check');
	await page.goto(`/sheets/${sheetId}`);
	const panel = page.getByRole('region', { name: 'Measured responses' });
	await expect(panel.getByText('No measured responses yet.')).toBeVisible();

	await panel.getByLabel(/Measured response \(CSV/).setInputFiles({
		name: 'sweep-a.csv',
		mimeType: 'text/csv',
		buffer: Buffer.from(lowPassCsv(0.5))
	});
	// The preview reads the semicolon / decimal-comma file and its units from the header.
	await expect(panel.getByText('Reads as 31 points from 1 kHz to 1 MHz.')).toBeVisible();
	await expect(panel.getByText('semicolon separated · decimal comma')).toBeVisible();
	await expect(panel.getByLabel('Frequency unit')).toHaveValue('kHz');
	await panel.getByLabel('Name').fill('Bench sweep A');
	await panel.getByRole('button', { name: 'Store measurement' }).click();
	await expect(panel.getByText('“Bench sweep A” stored: 31 points.')).toBeVisible();

	const plot = page.locator('figure', {
		has: page.getByRole('img', { name: /Frequency response/ })
	});
	await expect(plot.getByText('measured: Bench sweep A')).toBeVisible();
	await expect(plot.locator('[data-overlay="Bench sweep A"] path').first()).toHaveAttribute(
		'd',
		/^M/
	);

	const row = page.locator('[data-deviation="Bench sweep A"]');
	await expect(row).toContainText('0.50 dB');
	const cells = row.locator('td');
	await expect(cells.nth(2)).toContainText('0.50 dB'); // max: the +0.5 dB offset (closed form + 0.5)
	await expect(cells.nth(3)).toHaveText('0.50 dB'); // RMS
	await page.getByLabel('Band start (Hz)').fill('10k');
	await page.getByLabel('Band end (Hz)').fill('100k');
	// 1 kHz…1 MHz in 30 log steps puts 11 points in 10 kHz…100 kHz (both ends included).
	await expect(cells.nth(1)).toContainText('(11 points)');
	await plot.scrollIntoViewIfNeeded();
	await page.screenshot({ path: artifact('exchange-overlay.png'), fullPage: true });

	// Switching the legend entry off removes the overlay and its row.
	await panel.getByLabel('Overlay Bench sweep A on the response plot').uncheck();
	await expect(plot.getByText('measured: Bench sweep A')).toHaveCount(0);
	await expect(row).toHaveCount(0);
});

test('a bad row is pointed at in the preview before anything is stored', async ({ page }) => {
	await signInAs(page);
	const { sheetId } = await sheetWith(page, lowPass, 'RC low-pass, bad file');
	await page.goto(`/sheets/${sheetId}`);
	const panel = page.getByRole('region', { name: 'Measured responses' });
	const csv = 'Frequency (Hz),Magnitude (dB)\n1000,0\n2000,-0.1\n3000,n/a\n';
	await panel
		.getByLabel(/Measured response \(CSV/)
		.setInputFiles({ name: 'bad.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
	await expect(panel.getByRole('alert')).toHaveText(
		'row 4, column 2 (magnitude): "n/a" is not a number'
	);
	await expect(panel.getByRole('button', { name: 'Store measurement' })).toBeDisabled();
});
