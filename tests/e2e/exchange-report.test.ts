// The review report and its PDF: the page shows the schematic as SVG and the result tables; the
// downloaded PDF opens (pdftoppm renders it) and holds the sheet name and the pole table
// (pdftotext). Pole values: the 10:1 probe's exact natural frequencies, 1768 Hz and 353.7 MHz
// (common practice for a 9 MΩ ∥ 10 pF over 1 MΩ ∥ 90 pF probe driven from 50 Ω).
// On paper (issue 16, item 8): the plots' axis labels print at a readable size, every value
// carries its unit, and every page is white to its edges (no app tone under the last page).
import { execFileSync } from 'node:child_process';
import { mkdirSync, readdirSync, readFileSync } from 'node:fs';
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
	// Units everywhere: the schematic's values, the gains (V/V with dB; 1M/(9M + 1M) = 0.1 is
	// −20 dB, closed form of the divider).
	expect(text).toContain('50 Ω');
	expect(text).toContain('9 MΩ');
	expect(text).toContain('0.0999995 V/V');
	expect(text).toContain('(−20.00 dB)');

	// Readable plots: the frequency response's axis labels ("… dB", "…°") stand at least 7 pt
	// tall on the A4 page, as pdftotext boxes them (side by side they measured 6.8 pt: a 5 pt
	// font).
	const words = [
		...execFileSync('pdftotext', ['-bbox', file, '-'])
			.toString()
			.matchAll(
				/<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="([\d.]+)">([^<]*)<\/word>/g
			)
	].map((m) => ({ height: Number(m[4]) - Number(m[2]), text: m[5] }));
	const axis = words.filter((w) => /^−?\d+°$/.test(w.text) || w.text === 'dB');
	expect(axis.length).toBeGreaterThan(4);
	expect(Math.min(...axis.map((w) => w.height))).toBeGreaterThanOrEqual(7);

	// Clean pages: printed, the page's root and body are white (the root kept the app's paper
	// tone, which showed below the end of the last page), and every page of the PDF, rendered in
	// grey, is white along its bottom margin and white for most of its area — on the last page
	// the paper tone used to fill everything below the text.
	await page.emulateMedia({ media: 'print' });
	const grounds = await page.evaluate(() =>
		[document.documentElement, document.body].map((e) => getComputedStyle(e).backgroundColor)
	);
	expect(grounds).toEqual(['rgb(255, 255, 255)', 'rgb(255, 255, 255)']);
	execFileSync('pdftoppm', ['-gray', '-r', '30', file, path.join(dir, 'grey')]);
	const pages = readdirSync(dir).filter((f) => f.startsWith('grey') && f.endsWith('.pgm'));
	expect(pages.length).toBeGreaterThan(1);
	for (const f of pages) {
		const { width, height, pixels } = readPgm(readFileSync(path.join(dir, f)));
		const bottom = pixels.subarray((height - Math.floor(height * 0.04)) * width);
		expect(Math.min(...bottom), `${f}: bottom margin`).toBe(255);
		const count = new Array<number>(256).fill(0);
		for (const p of pixels) count[p]++;
		expect(count.indexOf(Math.max(...count)), `${f}: the most common shade`).toBe(255);
	}
});

/** A binary PGM (P5, 8 bit) as poppler writes it. */
function readPgm(buf: Buffer): { width: number; height: number; pixels: Uint8Array } {
	const head = /^P5\s+(\d+)\s+(\d+)\s+(\d+)\s/.exec(buf.subarray(0, 64).toString('latin1'));
	if (!head) throw new Error('not a binary PGM');
	const [width, height] = [Number(head[1]), Number(head[2])];
	return { width, height, pixels: new Uint8Array(buf.subarray(head[0].length)) };
}

test('someone without access to the sheet gets no PDF', async ({ page, browser }) => {
	await signInAs(page);
	const { sheetId } = await sheetWith(page, probe, 'Private probe');
	const other = await browser.newPage();
	await signInAs(other, 'reviewer');
	const r = await other.request.get(`/api/sheets/${sheetId}/report.pdf`);
	expect(r.status()).toBe(404);
	await other.close();
});
