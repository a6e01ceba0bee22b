// The docs images (light and dark) of a seeded demo sheet, and the edit → results timing on the
// three demo networks (figures for docs/performance.md, printed and kept in test-results/).
import { expect, test, type Page } from '@playwright/test';
import { mkdirSync, writeFileSync } from 'node:fs';
import { demoSheets } from '../../src/lib/server/db/seed/demo-sheets';
import { analysis, newSheet, node, openSheet, signIn, signUpFresh } from './editor-helpers';

async function demoSheetId(page: Page, name: string): Promise<string> {
	const { workspaces } = await (await page.request.get('/api/workspaces')).json();
	for (const w of workspaces as { id: string }[]) {
		const { sheets } = await (
			await page.request.get(`/api/workspaces/${w.id}/sheets?perPage=100`)
		).json();
		const hit = (sheets as { id: string; name: string }[]).find((s) => s.name === name);
		if (hit) return hit.id;
	}
	throw new Error(`demo sheet "${name}" not found`);
}

test('editor screenshots, light and dark, of the seeded divider', async ({ page }) => {
	test.setTimeout(90_000);
	await page.setViewportSize({ width: 1440, height: 1180 });
	await signIn(page, 'demo@polewise.test', 'polewise-demo');
	const id = await demoSheetId(page, demoSheets[0].name);
	for (const theme of ['light', 'dark'] as const) {
		await page.context().addCookies([{ name: 'pw-theme', value: theme, url: page.url() }]);
		await openSheet(page, id);
		await expect(page.locator('html')).toHaveAttribute('data-theme', theme);
		await expect(analysis(page)).toHaveAttribute('data-analysis-status', 'done');
		// Pick the slow pole so its owners light up on the canvas.
		await page.getByRole('button', { name: 'Show the parts that set pole 1' }).click();
		await expect(page.locator('.pw-symbol-lit').first()).toBeVisible();
		await page.locator('.pw-canvas').scrollIntoViewIfNeeded();
		await page.screenshot({ path: `docs/images/editor-${theme}.png` });
	}
});

// A measurement, not a timed test: tagged @bench, it runs in `npm run bench` (not in `npm test`).
test('edit → results time on the demo networks', { tag: '@bench' }, async ({ page }) => {
	test.setTimeout(90_000);
	await signUpFresh(page);
	const figures: Record<string, { inPageMs: number[]; wallMs: number[]; requestMs: number[] }> = {};
	for (const demo of demoSheets) {
		await openSheet(page, await newSheet(page, demo.document, demo.name));
		await expect(analysis(page)).toHaveAttribute('data-analysis-status', 'done');
		const r = demo.document.elements.find((e) => e.type === 'R')!;
		await node(page, r.id).click();
		const field = page.getByRole('region', { name: 'Properties' }).getByLabel(/Resistance/);
		const inPageMs: number[] = [];
		const wallMs: number[] = [];
		const requestMs: number[] = [];
		for (let i = 0; i < 6; i++) {
			const sent = Number(await analysis(page).getAttribute('data-analysis-sent'));
			const t0 = Date.now();
			await field.fill(i % 2 ? String(r.value) : `${1 + i / 10}k`);
			await expect(analysis(page)).toHaveAttribute('data-analysis-sent', String(sent + 1));
			await expect(analysis(page)).toHaveAttribute('data-analysis-status', 'done');
			wallMs.push(Date.now() - t0);
			inPageMs.push(Number(await analysis(page).getAttribute('data-analysis-ms')));
			// The request alone (server, worker pool, transfer), from the browser's resource timing.
			requestMs.push(
				await page.evaluate(() => {
					const r = performance
						.getEntriesByType('resource')
						.filter((e) => e.name.includes('/api/analyze'))
						.pop() as PerformanceResourceTiming | undefined;
					return r ? r.responseEnd - r.startTime : NaN;
				})
			);
		}
		figures[demo.name] = { inPageMs, wallMs, requestMs };
	}
	const median = (a: number[]) => [...a].sort((x, y) => x - y)[Math.floor(a.length / 2)];
	const table = Object.entries(figures).map(([k, v]) => ({
		sheet: k,
		medianInPageMs: median(v.inPageMs),
		maxInPageMs: Math.max(...v.inPageMs),
		medianWallMs: median(v.wallMs),
		medianRequestMs: median(v.requestMs)
	}));
	mkdirSync('test-results', { recursive: true });
	writeFileSync('test-results/editor-timing.json', JSON.stringify({ table, figures }, null, 2));
	console.log(JSON.stringify(table));
	// Every edit produced a finished analysis (asserted above for each); the times are reported
	// in test-results/editor-timing.json and docs/performance.md, not asserted.
	for (const row of table) expect(Number.isFinite(row.medianInPageMs)).toBe(true);
});
