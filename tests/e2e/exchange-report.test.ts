// The review report and its PDF: the page shows the schematic as SVG and the result tables; the
// downloaded PDF opens (pdftoppm renders it) and holds the sheet name and the pole table
// (pdftotext). Pole values: the 10:1 probe's exact natural frequencies, 1768 Hz and 353.7 MHz
// (common practice for a 9 MΩ ∥ 10 pF over 1 MΩ ∥ 90 pF probe driven from 50 Ω).
import { execFileSync } from 'node:child_process';
import { mkdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { expect, test } from '@playwright/test';
import { signInAs, probe, sheetWith } from './exchange-support';
import { artifact } from './artifacts';

test('the report page and its PDF hold the sheet name and the pole table', async ({ page }) => {
	test.setTimeout(90_000);
	await signInAs(page);
	const name = 'Probe 10x — bench 4';
	const { sheetId } = await sheetWith(page, probe, name);
	await page.goto(`/sheets/${sheetId}/report`);
	await expect(page.getByRole('heading', { level: 1, name })).toBeVisible();
	await expect(
		page.getByRole('img', { name: /Schematic of the network, 6 elements/ })
	).toBeVisible();
	await expect(page.getByRole('table', { name: 'Poles' })).toContainText('1.768');
	await expect(page.getByLabel('Safety caution').first()).toBeVisible();
	await page.screenshot({ path: artifact('exchange-report-page.png'), fullPage: true });

	const [download] = await Promise.all([
		page.waitForEvent('download', { timeout: 60_000 }),
		page.getByRole('link', { name: 'Download PDF' }).click()
	]);
	const dir = artifact('pdf');
	mkdirSync(dir, { recursive: true });
	const file = path.join(dir, 'report.pdf');
	await download.saveAs(file);
	expect(download.suggestedFilename()).toMatch(/-r1-report\.pdf$/);
	expect(readFileSync(file).subarray(0, 5).toString()).toBe('%PDF-');
	// It opens: poppler renders every page to PNG.
	execFileSync('pdftoppm', ['-png', '-r', '50', file, path.join(dir, 'page')]);
	const text = execFileSync('pdftotext', ['-layout', file, '-']).toString().replace(/\s+/g, ' ');
	expect(text).toContain(name);
	expect(text).toContain('Poles and what sets them');
	expect(text).toMatch(/p1 .*1\.768\d* kHz/);
	expect(text).toMatch(/p2 .*353\.\d+ MHz/);
	expect(text).toContain('Small-signal model only');
});

test('someone without access to the sheet gets no PDF', async ({ page, browser }) => {
	await signInAs(page);
	const { sheetId } = await sheetWith(page, probe, 'Private probe');
	const other = await browser.newPage();
	await signInAs(other, 'reviewer');
	const r = await other.request.get(`/api/sheets/${sheetId}/report.pdf`);
	expect(r.status()).toBe(404);
	await other.close();
});
