// Layout of the sheet page and its neighbours (issue 16, item 7): the time-constant table is
// whole at 1440 px, the review sits above the drawing, T-junctions have dots (canvas and
// report), the status line stops saying "to open the sheet" once edited, dates read one way,
// and the canvas carries no library mark (its notice is on the credits page).
import { expect, test } from '@playwright/test';
import { newSheet, node, openSheet, signUpFresh } from './editor-helpers';

// The 10:1 probe divider (common practice: 9 MΩ ∥ Ctop over 1 MΩ ∥ 90 pF, from 50 Ω). Rt ∥ Ct and
// Rin ∥ Cin make T-junctions where three conductors meet.
const divider = {
	schema: 1,
	elements: [
		{ id: 'Vin', type: 'V', nodes: ['src', 'gnd'], value: 1 },
		{ id: 'Rsrc', type: 'R', nodes: ['src', 'a'], value: '50' },
		{ id: 'Rt', type: 'R', nodes: ['a', 'b'], value: '9M' },
		{ id: 'Ct', type: 'C', nodes: ['a', 'b'], value: '10p' },
		{ id: 'Rin', type: 'R', nodes: ['b', 'gnd'], value: '1M' },
		{ id: 'Cin', type: 'C', nodes: ['b', 'gnd'], value: '90p' }
	],
	input: 'Vin',
	output: { node: 'b' }
};

test('the sheet page at 1440 px: review first, whole tables, junction dots, an honest status line', async ({
	page
}) => {
	await page.setViewportSize({ width: 1440, height: 900 });
	await signUpFresh(page);
	const id = await newSheet(page, divider, 'Layout divider');
	await openSheet(page, id);
	const status = page
		.getByRole('region', { name: 'Analysis', exact: true })
		.getByRole('status')
		.first();
	// The opening analysis comes with the page (nothing timed in the browser): it says so.
	await expect(status).toContainText('computed with the page');

	// The review panel comes before the drawing, within the first screen.
	const review = page.locator('#review-panel');
	const drawing = page.locator('#drawing');
	const [r, d] = [(await review.boundingBox())!, (await drawing.boundingBox())!];
	expect(r.y).toBeLessThan(d.y);
	expect(r.y).toBeLessThan(900);

	// Every column of the time-constant table is inside its box (nothing cut off).
	const table = page.getByRole('table', { name: /time constant/i }).first();
	await expect(table).toBeVisible();
	const fit = await table.evaluate((t) => ({
		table: t.scrollWidth,
		box: t.parentElement!.clientWidth
	}));
	expect(fit.table).toBeLessThanOrEqual(fit.box);
	const last = table.locator('thead th').last();
	const lastBox = (await last.boundingBox())!;
	expect(lastBox.x + lastBox.width).toBeLessThanOrEqual(1440);

	// T-junctions (three conductors at a terminal) get a dot.
	await expect(page.locator('.pw-canvas .pw-terminal-junction').first()).toBeVisible();
	// No library mark on the canvas; the footer links the credits, which name the library.
	await expect(page.locator('.svelte-flow__attribution')).toHaveCount(0);

	// Moving a part changes the drawing, not the network: the line says so and drops the
	// opening time; a value edit is timed "from the edit".
	await node(page, 'Rsrc').click();
	await page.keyboard.press('Alt+ArrowDown'); // Alt+arrows nudge; plain arrows move the focus
	await expect(status).toContainText('the last edit moved the drawing, not the network');
	await expect(status).not.toContainText('to open the sheet');
	await node(page, 'Rt').click();
	await page
		.getByRole('region', { name: 'Properties' })
		.getByLabel(/Resistance/)
		.fill('9.1M');
	await expect(status).toContainText('from the edit');
	await expect(status).not.toContainText('to open the sheet');

	await expect(page.locator('[data-save-status]')).toHaveAttribute('data-save-status', 'saved', {
		timeout: 15_000
	});
	await page.getByRole('link', { name: 'Credits' }).click();
	await expect(page.getByRole('table', { name: 'Open-source software in Polewise' })).toContainText(
		'@xyflow/svelte'
	);
	await expect(page.getByRole('heading', { name: 'MIT licence' })).toBeVisible();
});

test('the report draws junction dots; dates read the same on the account page as in the sheet list', async ({
	page
}) => {
	await signUpFresh(page);
	const id = await newSheet(page, divider, 'Dates and dots');
	await page.goto(`/sheets/${id}/report`);
	expect(await page.getByTestId('junctions').locator('circle').count()).toBeGreaterThan(0);

	const oneWay = /^\d{1,2} [A-Z][a-z]{2} \d{4}, \d{2}:\d{2} UTC$/;
	await page.goto('/account');
	const stamp = page
		.getByRole('region', { name: 'Recent account activity' })
		.locator('li span.tabular-nums')
		.first();
	const text = ((await stamp.textContent()) ?? '').split(' · ')[0].trim();
	expect(text).toMatch(oneWay);
	await page.goto('/workspaces');
	await page.locator('a[href^="/workspaces/"]').first().click();
	const listed = ((await page.locator('table time').first().textContent()) ?? '').trim();
	expect(listed).toMatch(oneWay);
});
