// The docs images (light and dark) of a seeded demo sheet, and the edit → results timing on the
// three demo networks (figures for docs/performance.md, printed and kept in test-results/).
import { expect, test, type Page } from '@playwright/test';
import { mkdirSync, writeFileSync } from 'node:fs';
import { loadavg } from 'node:os';
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
		await page.getByRole('button', { name: 'p1: show the parts that set this pole' }).click();
		await expect(page.locator('.pw-symbol-lit').first()).toBeVisible();
		await page.locator('.pw-canvas').scrollIntoViewIfNeeded();
		// Every part's comment marker sits clear of every name/value label on the canvas.
		const overlaps = await page.evaluate(() => {
			const boxes = (sel: string) =>
				[...document.querySelectorAll(sel)].map((e) => e.getBoundingClientRect());
			const labels = boxes('.pw-canvas .pw-labels');
			return boxes('.pw-canvas .pw-node-marker').filter((m) =>
				labels.some(
					(l) => m.left < l.right && l.left < m.right && m.top < l.bottom && l.top < m.bottom
				)
			).length;
		});
		expect(await page.locator('.pw-canvas .pw-node-marker .pw-comment-marker').count()).toBe(
			demoSheets[0].document.elements.length
		);
		expect(overlaps).toBe(0);
		await page.screenshot({ path: `docs/images/editor-${theme}.png` });
	}
});

// A measurement, not a timed test: tagged @bench, it runs in `npm run bench` (not in `npm test`).
test('edit → results time on the demo networks', { tag: '@bench' }, async ({ page }) => {
	test.setTimeout(90_000);
	await signUpFresh(page);
	const figures: Record<
		string,
		{
			inPageMs: number[];
			wallMs: number[];
			requestMs: number[];
			phases: Record<string, number>[];
			responseBytes: number;
		}
	> = {};
	for (const demo of demoSheets) {
		await openSheet(page, await newSheet(page, demo.document, demo.name));
		await expect(analysis(page)).toHaveAttribute('data-analysis-status', 'done');
		const r = demo.document.elements.find((e) => e.type === 'R')!;
		await node(page, r.id).click();
		const field = page.getByRole('region', { name: 'Properties' }).getByLabel(/Resistance/);
		const inPageMs: number[] = [];
		const wallMs: number[] = [];
		const requestMs: number[] = [];
		const phases: Record<string, number>[] = [];
		let responseBytes = NaN;
		for (let i = 0; i < 6; i++) {
			const sent = Number(await analysis(page).getAttribute('data-analysis-sent'));
			// Wait inside the page with a MutationObserver: Playwright's own polling of a
			// role locator walks the page's accessibility tree on the main thread every few
			// milliseconds, which delays the very work being measured.
			const finished = page.evaluate(
				(n) =>
					new Promise<void>((resolve) => {
						const el = document.querySelector<HTMLElement>('section[data-analysis-sent]')!;
						const done = () =>
							el.dataset.analysisSent === String(n) && el.dataset.analysisStatus === 'done';
						new MutationObserver((_, mo) => {
							if (done()) resolve(mo.disconnect());
						}).observe(el, { attributes: true });
					}),
				sent + 1
			);
			const t0 = Date.now();
			await field.fill(i % 2 ? String(r.value) : `${1 + i / 10}k`);
			await finished;
			wallMs.push(Date.now() - t0);
			inPageMs.push(Number(await analysis(page).getAttribute('data-analysis-ms')));
			phases.push(JSON.parse((await analysis(page).getAttribute('data-analysis-phases'))!));
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
			responseBytes = await page.evaluate(() => {
				const r = performance
					.getEntriesByType('resource')
					.filter((e) => e.name.includes('/api/analyze'))
					.pop() as PerformanceResourceTiming | undefined;
				return r?.decodedBodySize ?? NaN;
			});
		}
		figures[demo.name] = { inPageMs, wallMs, requestMs, phases, responseBytes };
	}
	const median = (a: number[]) => [...a].sort((x, y) => x - y)[Math.floor(a.length / 2)];
	const table = Object.entries(figures).map(([k, v]) => ({
		sheet: k,
		medianInPageMs: median(v.inPageMs),
		maxInPageMs: Math.max(...v.inPageMs),
		medianWallMs: median(v.wallMs),
		medianRequestMs: median(v.requestMs),
		// Where the time goes, median of each phase (ms from the edit; see live-analysis.svelte.ts).
		medianPhases: Object.fromEntries(
			Object.keys(v.phases[0]).map((k) => [k, median(v.phases.map((p) => p[k]))])
		),
		responseBytes: v.responseBytes
	}));
	mkdirSync('test-results', { recursive: true });
	const load = loadavg().map((l) => l.toFixed(2));
	writeFileSync(
		'test-results/editor-timing.json',
		JSON.stringify({ load, table, figures }, null, 2)
	);
	console.log(`load average ${load.join(' ')}`);
	console.log(JSON.stringify(table));
	// Every edit produced a finished analysis (asserted above for each); the times are reported
	// in test-results/editor-timing.json and docs/performance.md, not asserted.
	for (const row of table) expect(Number.isFinite(row.medianInPageMs)).toBe(true);
});
