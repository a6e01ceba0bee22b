// One naming of nets (issue 16, item 3): a sheet made with node names (src, tip, adc) shows the
// same names in the drawing (on hover or with "Net names" on), the output picker, the comment
// "About" list and the Touchstone ports — never n1, n2, …; renaming a net from a selected wire
// renames it in the saved document, and every picker follows.
import { expect, test } from '@playwright/test';
import { newSheet, openSheet, signUpFresh } from './editor-helpers';
import { digitizerDivider } from '../../src/lib/server/db/seed/demo-sheets';

// The demo's 10:1 divider: nodes src, tip and adc.
const divider = digitizerDivider;

test('net names: the same everywhere, shown on the canvas, renamed from a wire', async ({
	page
}) => {
	test.setTimeout(90_000);
	await page.setViewportSize({ width: 1440, height: 1000 });
	await signUpFresh(page);
	const id = await newSheet(page, divider, 'Named nets');
	await openSheet(page, id);
	const props = page.getByRole('region', { name: 'Properties' });
	const outputPicker = props.getByLabel('Output node');
	await expect(outputPicker).toHaveValue('adc');
	const offered = await outputPicker.locator('option').allTextContents();
	expect(offered.filter((o) => !o.startsWith('—')).sort()).toEqual(['adc', 'src', 'tip']);
	const about = page.locator('#review-panel').getByLabel('About');
	await expect(about.locator('option', { hasText: 'net adc' })).toHaveCount(1);
	await expect(about.locator('option', { hasText: /^net n\d/ })).toHaveCount(0);

	// Names on the canvas: hidden until asked for, then one tag per net.
	const tags = page.locator('.pw-canvas .pw-net-tag.pw-net-tag-on');
	await expect(tags).toHaveCount(0);
	await page.getByLabel('Net names').check();
	await expect(tags).toHaveCount(3);
	expect((await tags.allTextContents()).sort()).toEqual(['adc', 'src', 'tip']);
	await page.screenshot({ path: 'docs/images/net-names-light.png' });

	// Select a wire on adc and rename the net.
	await page
		.locator('.pw-canvas .svelte-flow__edge[aria-label^="Wire on adc,"]')
		.first()
		.click({ force: true });
	const field = props.getByLabel('Net name');
	await field.fill('gnd');
	await expect(props.getByRole('alert')).toContainText('reference node');
	await field.fill('digitizer_in');
	await field.press('Enter');
	await expect(outputPicker).toHaveValue('digitizer_in');
	await expect(page.locator('[data-save-status]')).toHaveAttribute('data-save-status', 'saved', {
		timeout: 15_000
	});
	const saved = await (await page.request.get(`/api/sheets/${id}`)).json();
	expect(saved.revision.document.output.node).toBe('digitizer_in');
	expect(
		saved.revision.document.elements.find((e: { id: string }) => e.id === 'Radc').nodes[0]
	).toBe('digitizer_in');

	// After a reload every picker says the new name.
	await page.reload();
	await expect(outputPicker).toHaveValue('digitizer_in');
	await expect(about.locator('option', { hasText: 'net digitizer_in' })).toHaveCount(1);
	await page.getByRole('button', { name: 'Touchstone two-port…' }).click();
	const dialog = page.getByRole('dialog', { name: 'Touchstone two-port (.s2p)' });
	await expect(
		dialog.getByLabel('+ terminal').first().locator('option', { hasText: 'digitizer_in' })
	).toHaveCount(1);
	await page.keyboard.press('Escape');
	await page.evaluate(() => (document.documentElement.dataset.theme = 'dark'));
	await page.locator('#drawing').screenshot({ path: 'docs/images/net-names-dark.png' });
});
