// Acceptance: the 10:1 divider is drawn from an empty sheet with the mouse, its values typed,
// input and output marked, and the pole table read back against the closed form.
import { expect, test } from '@playwright/test';
import { artifact } from './artifacts';
import {
	analysis,
	dividerPolesHz,
	EMPTY_SHEET as EMPTY,
	dropPart,
	newSheet,
	node,
	nodeOfKind,
	openSheet,
	poleHz,
	setValue,
	signUpFresh,
	terminal,
	wire
} from './editor-helpers';

test('draw the 10:1 divider from an empty sheet and read its exact poles', async ({ page }) => {
	test.setTimeout(90_000);
	await page.setViewportSize({ width: 1440, height: 1000 });
	await signUpFresh(page);
	await openSheet(page, await newSheet(page, EMPTY, 'Divider from scratch'));
	await expect(analysis(page)).toContainText('the sheet is empty');

	await dropPart(page, 'Voltage source', 120, 260);
	await dropPart(page, 'Resistor', 260, 160);
	await dropPart(page, 'Resistor', 440, 120);
	await dropPart(page, 'Capacitor', 440, 220);
	await dropPart(page, 'Resistor', 640, 300);
	await dropPart(page, 'Capacitor', 760, 300);
	await dropPart(page, 'Ground', 420, 440);
	await dropPart(page, 'Output marker', 900, 180);
	for (const n of ['V1', 'R1', 'R2', 'R3', 'C1', 'C2']) await expect(node(page, n)).toBeVisible();

	// The two shunt parts stand upright: select each and turn it a quarter turn (R).
	for (const n of ['R3', 'C2']) {
		await node(page, n).click();
		await page.keyboard.press('r');
	}
	const t = (n: string, k: string) => terminal(page, node(page, n), k);
	const gnd = terminal(page, nodeOfKind(page, 'GND'), 'g');
	const out = terminal(page, nodeOfKind(page, 'PROBE'), 'pos');
	const wires: [ReturnType<typeof t>, ReturnType<typeof t>][] = [
		[t('V1', 'p'), t('R1', 'a')],
		[t('R1', 'b'), t('R2', 'a')],
		[t('R1', 'b'), t('C1', 'a')],
		[t('R2', 'b'), t('C1', 'b')],
		[t('C1', 'b'), t('R3', 'a')],
		[t('R3', 'a'), t('C2', 'a')],
		[t('C2', 'a'), out],
		[t('V1', 'n'), gnd],
		[t('R3', 'b'), gnd],
		[t('C2', 'b'), gnd]
	];
	await page.screenshot({ path: artifact('editor-divider-placed.png') });
	for (const [k, [from, to]] of wires.entries()) {
		await wire(page, from, to);
		await expect(page.locator('.svelte-flow__edge'), `wire ${k + 1}`).toHaveCount(k + 1);
	}

	await setValue(page, 'R1', '50');
	await setValue(page, 'R2', '9M');
	await expect(page.getByTestId('parsed-value')).toHaveText('9 MΩ');
	await setValue(page, 'C1', '10p');
	await setValue(page, 'R3', '1M');
	await setValue(page, 'C2', '90p');
	await expect(page.getByTestId('parsed-value')).toHaveText('90 pF');

	// Mark the input explicitly (the first source is offered by default) and check the output.
	const io = page.getByRole('group', { name: 'Input and output' });
	await io.getByLabel('Input source').selectOption({ label: 'V1' });
	await expect(io.getByLabel('Reference node')).toHaveValue('gnd');

	await expect(analysis(page)).toHaveAttribute('data-analysis-status', 'done');
	await expect(page.getByRole('table', { name: 'Poles' }).getByTestId('pole-hz')).toHaveCount(2);
	const shown = await poleHz(page);
	const expected = dividerPolesHz(50, 9e6, 10e-12, 1e6, 90e-12);
	// Common practice cross-check: near 1768 Hz and 353.7 MHz for this probe.
	expect(Number(expected[0].toPrecision(4))).toBe(1768);
	for (const [i, f] of expected.entries()) expect(Math.abs(shown[i] - f) / f).toBeLessThan(1e-6);
	// The owners: the slow pole belongs mostly to C2 (the 90 pF), the fast one to C1.
	await expect(
		page.getByRole('table', { name: 'Poles' }).locator('tbody tr').first()
	).toContainText('C2');
});
