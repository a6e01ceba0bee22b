// Variants in the browser: a designer turns a divider into a three-position range switch,
// overrides a value in one position, takes a part out of another, and sees the side-by-side
// table, the marks on the canvas and the overlaid plots follow; the variants survive a reload.
import { expect, test } from '@playwright/test';
import { analysis, newSheet, node, openSheet, signUpFresh } from './editor-helpers';

const divider = {
	schema: 1,
	title: 'Range switch',
	elements: [
		{ id: 'Vin', type: 'V', nodes: ['in', 'gnd'], value: 1 },
		{ id: 'R1', type: 'R', nodes: ['in', 'out'], value: '9M' },
		{ id: 'C1', type: 'C', nodes: ['in', 'out'], value: '10p' },
		{ id: 'R2', type: 'R', nodes: ['out', 'gnd'], value: '1M' },
		{ id: 'C2', type: 'C', nodes: ['out', 'gnd'], value: '80p' },
		{ id: 'Ctrim', type: 'C', nodes: ['out', 'gnd'], value: '10p' }
	],
	input: 'Vin',
	output: { node: 'out' }
};

test('create variants, override a value, take a part out of one position, see table and overlays', async ({
	page
}) => {
	test.setTimeout(90_000);
	await signUpFresh(page);
	const id = await newSheet(page, divider, 'Range switch');
	await openSheet(page, id);
	await expect(analysis(page)).toHaveAttribute('data-analysis-status', 'done');
	await expect(page.getByTestId('variants-side-by-side')).toHaveCount(0);

	// One group, three positions.
	await page.getByRole('button', { name: /^Add variants/ }).click();
	const editor = page.getByTestId('variant-editor');
	await editor.getByRole('textbox', { name: 'Option 1 of Range' }).fill('10:1');
	await editor.getByRole('textbox', { name: 'Option 1 of Range' }).press('Enter');
	await editor.getByRole('textbox', { name: 'Option 2 of Range' }).fill('100:1');
	await editor.getByRole('textbox', { name: 'Option 2 of Range' }).press('Enter');
	await editor.getByRole('button', { name: 'Add option to Range' }).click();
	await editor.getByRole('textbox', { name: 'Option 3 of Range' }).fill('1000:1');
	await editor.getByRole('textbox', { name: 'Option 3 of Range' }).press('Enter');
	await expect(page.getByTestId('variant-count')).toHaveText('3 variants in all');

	// 100:1: R1 becomes 9.9M and R2 ∥ … — here only R1 changes, so DC gain = 1M / 10.9M.
	await node(page, 'R1').click();
	const props = page.getByRole('region', { name: 'Properties' });
	await props.getByLabel('Value of R1 in Range: 100:1').fill('9.9M');
	await props.getByLabel('Value of R1 in Range: 100:1').press('Enter');
	// 1000:1 works without the trimmer.
	await node(page, 'Ctrim').click();
	await props.getByLabel('Ctrim in the network in Range: 1000:1').uncheck();

	const table = page.getByTestId('variant-figures');
	await expect(table.locator('tbody tr')).toHaveCount(3);
	// Closed form (voltage divider): 1M/(9M + 1M) = 0.1 and 1M/(9.9M + 1M) = 0.0917431.
	await expect(table.locator('tr[data-variant="10:1"]')).toContainText('0.1');
	await expect(table.locator('tr[data-variant="100:1"]')).toContainText('0.0917431');
	await expect(analysis(page)).toHaveAttribute('data-analysis-status', 'done');

	// The overlays draw one curve per variant, each named (legend and titles).
	const responses = page.getByTestId('variant-responses');
	await expect(
		responses.getByRole('list', { name: 'Legend of the overlaid responses' }).locator('li')
	).toHaveCount(3);
	await expect(responses.locator('svg path title')).toHaveCount(6); // magnitude and step, 3 each
	await expect(
		page.getByTestId('variant-splane').locator('path title', { hasText: '1000:1: pole' })
	).not.toHaveCount(0);

	// Pick 1000:1: the trimmer is drawn "out", the result panels show that variant.
	await page.getByLabel('Range (variant group)').selectOption({ label: '1000:1' });
	await expect(node(page, 'Ctrim')).toContainText('out');
	await expect(page.getByTestId('variant-overrides')).toContainText('Ctrim out');
	await expect(page.getByTestId('variant-shown')).toContainText('1000:1');
	// Pick 100:1: R1's value on the canvas is the variant's, marked ◇.
	await page.getByLabel('Range (variant group)').selectOption({ label: '100:1' });
	await expect(node(page, 'R1')).toContainText('◇ 9.9M');

	// Saved with the drawing: after a reload the three variants are still there.
	await expect(page.getByText(/Saved · revision [2-9]/)).toBeVisible({ timeout: 15_000 });
	await page.reload();
	await expect(analysis(page)).toHaveAttribute('data-analysis-status', 'done');
	await expect(page.getByTestId('variant-figures').locator('tbody tr')).toHaveCount(3);
	const saved = await (await page.request.get(`/api/sheets/${id}`)).json();
	expect(saved.revision.document.variants.groups[0].options).toEqual([
		{ name: '10:1' },
		{ name: '100:1', values: { R1: '9.9M' } },
		{ name: '1000:1', absent: ['Ctrim'] }
	]);

	// The report: no limits and no specs across variants are set on this sheet, so it judges
	// nothing and says so (no green "every spec holds" about no spec at all).
	await page.goto(`/sheets/${id}/report`);
	await expect(page.getByTestId('variant-spec-empty')).toBeVisible();
	await expect(page.getByTestId('variant-spec-verdict')).toHaveCount(0);
});
