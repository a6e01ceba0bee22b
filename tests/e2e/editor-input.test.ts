// Editor input (issue 16, item 9): Ctrl+A then Delete empties the drawing; R turns a part just
// dropped; a negative resistor is accepted with a warning on the symbol and in the panel;
// "1e-400" is said to underflow; the trade's letter-and-numeral code (IEC 60062: 2k2, 4n7) and
// a unit word after a space ("1k ohm", "10 pF") are read — by the editor and by the API alike.
import { expect, test } from '@playwright/test';
import {
	analysis,
	dropPart,
	newSheet,
	node,
	openSheet,
	signUpFresh,
	RC_LOW_PASS
} from './editor-helpers';

const RC = RC_LOW_PASS;
const canvasNodes = (page: import('@playwright/test').Page) =>
	page.locator('.pw-canvas .svelte-flow__node');

test('Ctrl+A then Delete empties the drawing; Ctrl+Z brings it back', async ({ page }) => {
	await signUpFresh(page);
	await openSheet(page, await newSheet(page, RC, 'Select all'));
	const before = await canvasNodes(page).count();
	expect(before).toBeGreaterThan(3);
	await node(page, 'R1').click();
	await page.keyboard.press('Control+a');
	await expect(page.locator('.pw-canvas .svelte-flow__node.selected')).toHaveCount(before);
	await page.keyboard.press('Delete');
	await expect(canvasNodes(page)).toHaveCount(0);
	await page.keyboard.press('Control+z');
	await expect(canvasNodes(page)).toHaveCount(before);
});

test('R turns the part just dropped', async ({ page }) => {
	await signUpFresh(page);
	await openSheet(page, await newSheet(page, RC, 'Turn after drop'));
	await dropPart(page, 'Resistor', 420, 320);
	const dropped = node(page, 'R2');
	await expect(dropped.locator('.pw-symbol')).toHaveAttribute('data-rotation', '0');
	await page.keyboard.press('r');
	await expect(dropped.locator('.pw-symbol')).toHaveAttribute('data-rotation', '90');
});

test('values: a negative resistor warns, 1e-400 underflows, 2k2 / 4n7 / "1k ohm" / "10 pF" are read', async ({
	page
}) => {
	await signUpFresh(page);
	await openSheet(page, await newSheet(page, RC, 'Values as typed'));
	const props = page.getByRole('region', { name: 'Properties' });

	await node(page, 'R1').click();
	const r = props.getByLabel(/Resistance/);
	await r.fill('-1k');
	await expect(props.getByTestId('value-warning-panel')).toContainText('a negative resistor');
	await expect(node(page, 'R1').getByTestId('value-warning')).toContainText('negative');
	// Accepted: the analysis runs (and says the same in its warnings).
	await expect(analysis(page)).toHaveAttribute('data-analysis-status', 'done');

	await r.fill('2k2');
	await expect(props.getByTestId('parsed-value')).toHaveText('2.2 kΩ');
	await expect(props.getByTestId('value-warning-panel')).toHaveCount(0);
	await expect(node(page, 'R1').getByTestId('value-warning')).toHaveCount(0);
	await r.fill('1k ohm');
	await expect(props.getByTestId('parsed-value')).toHaveText('1 kΩ');

	await node(page, 'C1').click();
	const c = props.getByLabel(/Capacitance/);
	await c.fill('1e-400');
	await expect(props).toContainText('value "1e-400" underflows');
	await expect(props).not.toContainText('0 is not allowed');
	await c.fill('4n7');
	await expect(props.getByTestId('parsed-value')).toHaveText('4.7 nF');
	await c.fill('10 pF');
	await expect(props.getByTestId('parsed-value')).toHaveText('10 pF');
	await expect(analysis(page)).toHaveAttribute('data-analysis-status', 'done');
});

test('the API reads the same notation and names an underflow', async ({ page }) => {
	await signUpFresh(page);
	const doc = (r: string, c: string) => ({
		...RC,
		elements: [RC.elements[0], { ...RC.elements[1], value: r }, { ...RC.elements[2], value: c }]
	});
	const ok = await page.request.post('/api/analyze', { data: doc('2k2', '4n7') });
	expect(ok.status()).toBe(200);
	// One-pole RC (closed form): p = −1/(RC) = −1/(2.2 kΩ · 4.7 nF).
	const { poles } = await ok.json();
	expect(Math.abs(poles[0].re + 1 / (2.2e3 * 4.7e-9)) * 2.2e3 * 4.7e-9).toBeLessThan(1e-9);
	const spaced = await page.request.post('/api/analyze', { data: doc('1k ohm', '10 pF') });
	expect(spaced.status()).toBe(200);
	const tiny = await page.request.post('/api/analyze', { data: doc('1k', '1e-400') });
	expect(tiny.status()).toBeGreaterThanOrEqual(400);
	expect((await tiny.json()).error).toMatch(/element "C1": value "1e-400" underflows/);
});
