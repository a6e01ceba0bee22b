// Dragging stays smooth on a large drawing: a 100-section RC ladder (201 elements, 300 marks and
// parts on the canvas). Frame intervals are sampled with requestAnimationFrame while one part is
// dragged; figures go to test-results/editor-drag.json for docs/performance.md.
import { expect, test, type Locator, type Page } from '@playwright/test';
import { mkdirSync, writeFileSync } from 'node:fs';
import { newSheet, node, openSheet, signUpFresh } from './editor-helpers';

const SECTIONS = 100;
const ladder = {
	schema: 1,
	title: 'RC ladder, 100 sections',
	elements: [
		{ id: 'Vin', type: 'V', nodes: ['n0', 'gnd'], value: 1 },
		...Array.from({ length: SECTIONS }, (_, i) => [
			{ id: `R${i + 1}`, type: 'R', nodes: [`n${i}`, `n${i + 1}`], value: '1k' },
			{ id: `C${i + 1}`, type: 'C', nodes: [`n${i + 1}`, 'gnd'], value: '1n' }
		]).flat()
	],
	input: 'Vin',
	output: { node: `n${SECTIONS}` }
};

// A measurement, not a timed test: tagged @bench, it runs in `npm run bench` (not in `npm test`).
test('dragging a part among 200 elements: frame intervals', { tag: '@bench' }, async ({ page }) => {
	test.setTimeout(150_000);
	await page.setViewportSize({ width: 1440, height: 1000 });
	await signUpFresh(page);
	await openSheet(page, await newSheet(page, ladder, ladder.title));
	// Even at the smallest zoom the ladder is wider than the view; a large sheet mounts only the
	// parts in view (xyflow's culling), so the middle part is there and the far ends may not be.
	await expect(node(page, 'R50')).toBeVisible();
	// The first analysis of the ladder is in (its tables are drawn) before the drag starts.
	await expect(page.getByRole('region', { name: 'Analysis', exact: true })).toHaveAttribute(
		'data-analysis-status',
		'done',
		{ timeout: 30_000 }
	);
	const part = node(page, 'R50');
	const fitted = await dragFrames(page, part);
	// Zoomed in to full size around R50: most of the ladder is off screen (what culling of
	// off-screen parts, if on, leaves out).
	for (let i = 0; i < 40 && (await part.boundingBox())!.width < 76; i++) {
		const b = (await part.boundingBox())!;
		await page.mouse.move(b.x + b.width / 2, b.y + b.height / 2);
		await page.mouse.wheel(0, -240);
		await page.waitForTimeout(60);
	}
	const zoomed = await dragFrames(page, part, 2);
	const mounted = await page.locator('.svelte-flow__node').count();
	const figures = {
		fitted,
		zoomed,
		mountedWhenZoomed: mounted,
		parts: 2 * SECTIONS + SECTIONS + 3
	};
	mkdirSync('test-results', { recursive: true });
	writeFileSync('test-results/editor-drag.json', JSON.stringify(figures, null, 2));
	console.log('drag frames', JSON.stringify(figures));
	// Fit view still counts the parts that are not mounted: back to the whole ladder.
	await page.keyboard.press('f');
	await expect.poll(async () => (await part.boundingBox())!.width).toBeLessThan(20);
	await expect.poll(() => page.locator('.svelte-flow__node').count()).toBeGreaterThan(mounted);
	expect(fitted.frames).toBeGreaterThan(10);
	expect(zoomed.frames).toBeGreaterThan(10);
});

/** Drag `part` along 60 pointer steps while sampling frame intervals; checks it really moved. */
async function dragFrames(page: Page, part: Locator, step = 5) {
	const box = (await part.boundingBox())!;
	await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
	await page.mouse.down();
	await page.evaluate(() => {
		const w = window as unknown as { pwFrames: number[]; pwRaf: number };
		w.pwFrames = [];
		let last = performance.now();
		const tick = (t: number) => {
			w.pwFrames.push(t - last);
			last = t;
			w.pwRaf = requestAnimationFrame(tick);
		};
		w.pwRaf = requestAnimationFrame(tick);
	});
	for (let i = 1; i <= 60; i++)
		await page.mouse.move(box.x + box.width / 2 + i * step, box.y + box.height / 2 + i * 2);
	const frames = await page.evaluate(() => {
		const w = window as unknown as { pwFrames: number[]; pwRaf: number };
		cancelAnimationFrame(w.pwRaf);
		return w.pwFrames.slice(1);
	});
	await page.mouse.up();
	// The part really moved with the pointer; the frame figures are reported, not asserted.
	const moved = (await part.boundingBox())!;
	expect(moved.x - box.x).toBeGreaterThan(40 * step);
	const sorted = [...frames].sort((a, b) => a - b);
	return {
		frames: frames.length,
		medianMs: sorted[sorted.length >> 1],
		p90Ms: sorted[Math.floor(sorted.length * 0.9)],
		maxMs: sorted[sorted.length - 1]
	};
}
