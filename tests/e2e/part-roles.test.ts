// Part roles (issue 16, item 5): the cable is a fixed value — snap leaves it alone and solve
// does not offer it (the API refuses it); the top capacitor made a trimmer in the properties
// panel solves to its setting on the range, and the answer is written into the drawing as one
// undoable step. Closed form for the flat divider: Ctop = Radc·(Ccable + Cadc)/Rtop =
// 1 MΩ · 60 pF / 9 MΩ = 6.667 pF (common practice; the 50 Ω source moves it a hair).
import { expect, test } from '@playwright/test';
import { newSheet, node, openSheet, signUpFresh } from './editor-helpers';
import { digitizerDivider } from '../../src/lib/server/db/seed/demo-sheets';

test('fixed cable, trimmer top capacitor: snap, solve and write respect the roles', async ({
	page
}) => {
	test.setTimeout(120_000);
	await page.setViewportSize({ width: 1440, height: 1000 });
	await signUpFresh(page, 'Ines Okafor');
	const id = await newSheet(page, digitizerDivider, 'Roles divider');
	await openSheet(page, id);
	await expect(node(page, 'Ccable')).toContainText('fixed');

	// The API refuses to solve for a fixed value, naming it.
	const refused = await page.request.post('/api/design/solve', {
		data: { document: digitizerDivider, element: 'Ccable', goal: { kind: 'flat' } }
	});
	expect(refused.status()).toBe(422);
	expect((await refused.json()).error).toMatch(/"Ccable" is a fixed value/);

	// Make Ctop a trimmer from 2 pF to 10 pF.
	await node(page, 'Ctop').click();
	const props = page.getByRole('region', { name: 'Properties' });
	await props.getByLabel('Role').selectOption('trimmer');
	await props.getByLabel('Trimmer range, lowest').fill('2p');
	await props.getByLabel('Trimmer range, highest').fill('10p');
	await expect(node(page, 'Ctop')).toContainText('trim 2p–10p');

	const aids = page.getByRole('region', { name: 'Design aids' });
	await aids.getByRole('tab', { name: 'Preferred values' }).click();
	await aids.getByRole('button', { name: /Snap to/ }).click();
	await expect(aids.getByTestId('snap-skipped')).toHaveText(
		'Left alone: Ctop (trimmer (set by adjustment)), Ccable (fixed value).'
	);

	await aids.getByRole('tab', { name: /Solve/ }).click();
	const pick = aids.getByLabel('Element to adjust');
	await expect(pick.locator('option', { hasText: 'Ccable' })).toHaveCount(0);
	await expect(aids.getByTestId('solve-fixed-note')).toContainText('Ccable');
	await pick.selectOption('Ctop');
	await aids.getByRole('button', { name: 'Solve' }).click();
	await expect(aids.getByTestId('solved-value')).toContainText(/Ctop = 6\.6\d{2,3} pF/);
	// (6.667 − 2) / (10 − 2) ≈ 58 % of the range.
	await expect(aids.getByTestId('trimmer-setting')).toContainText(
		'Trimmer setting: 58 % of its range'
	);
	await aids.getByRole('button', { name: /^Write Ctop = 6\.6\d+ pF into the drawing$/ }).click();
	await expect(node(page, 'Ctop')).toContainText(/6\.66\d* pF/);
	await page.screenshot({ path: 'docs/images/part-roles-light.png', fullPage: false });
	// One step back with Undo on the drawing.
	await page.getByLabel('Drawing commands').getByRole('button', { name: /Undo/ }).click();
	await expect(node(page, 'Ctop')).toContainText('6.8 pF');
	await page.evaluate(() => (document.documentElement.dataset.theme = 'dark'));
	await page.locator('#drawing').screenshot({ path: 'docs/images/part-roles-dark.png' });
});
