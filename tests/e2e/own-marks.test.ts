// Polewise's own marks (issue 16, item 10): the output is a reading dial that "reads H(s)", the
// input source is tagged "▸ drives H(s)", and a net name is written on a dotted leader — the same
// on the canvas, in the revision comparison and in the report. None of them is a five-sided port
// flag, a boxed "OUT" or a boxed "input" label. Screenshots (light and dark) go to docs/images.
import { expect, test, type Locator, type Page } from '@playwright/test';
import { drawingShot, newSheet, node, nodeOfKind, openSheet, signUpFresh } from './editor-helpers';

// The 10:1 probe divider on a scope input, from 50 Ω (common practice).
const probe = (rt: string) => ({
	schema: 1,
	elements: [
		{ id: 'Vin', type: 'V', nodes: ['src', 'gnd'], value: 1 },
		{ id: 'Rsrc', type: 'R', nodes: ['src', 'tip'], value: '50' },
		{ id: 'Rt', type: 'R', nodes: ['tip', 'adc'], value: rt },
		{ id: 'Ct', type: 'C', nodes: ['tip', 'adc'], value: '10p' },
		{ id: 'Rin', type: 'R', nodes: ['adc', 'gnd'], value: '1M' },
		{ id: 'Cin', type: 'C', nodes: ['adc', 'gnd'], value: '90p' }
	],
	input: 'Vin',
	output: { node: 'adc' }
});

/** Closed outlines with exactly five corners (a port flag's pentagon) among the paths inside. */
async function pentagons(scope: Locator): Promise<string[]> {
	const ds = await scope
		.locator('path')
		.evaluateAll((ps) => ps.map((p) => p.getAttribute('d') ?? ''));
	return ds.filter((d) => /z\s*$/i.test(d) && (d.match(/[MLHV]/gi) ?? []).length === 5);
}

/** The marks on one drawing: the dial's and the source's words, and no flag, "OUT" or "input". */
async function expectOwnMarks(scope: Locator) {
	await expect(scope.getByTestId('output-mark')).toHaveText('reads H(s)');
	await expect(scope.getByTestId('input-mark')).toHaveText('▸ drives H(s)');
	await expect(scope).not.toContainText(/\bOUT\b/);
	await expect(scope).not.toContainText(/\binput\b/i);
	expect(await pentagons(scope)).toEqual([]);
}

async function inTheme(page: Page, theme: 'light' | 'dark') {
	await page.evaluate((t) => (document.documentElement.dataset.theme = t), theme);
}

test('the output dial and the input tag: canvas, comparison and report, in our own shape and words', async ({
	page
}) => {
	test.setTimeout(90_000);
	await page.setViewportSize({ width: 1440, height: 900 });
	await signUpFresh(page, 'Oda Lindqvist');
	const id = await newSheet(page, probe('9M'), 'Marks — probe divider');
	await openSheet(page, id);

	// Canvas: the dial is a meter window with a needle, not a flag; its words and the source's.
	const canvas = page.locator('.pw-canvas');
	await expectOwnMarks(canvas);
	const dial = nodeOfKind(page, 'PROBE');
	await expect(dial.locator('svg rect')).toHaveCount(1);
	await expect(node(page, 'Vin').getByTestId('input-mark')).toBeVisible();
	// The parts list draws the same dial, and the net name mark without a flag either.
	const palette = page.getByRole('navigation', { name: 'Parts' });
	expect(await pentagons(palette)).toEqual([]);
	await expect(
		palette.getByRole('button', { name: 'Place Output marker' }).locator('svg rect')
	).toHaveCount(1);

	for (const theme of ['light', 'dark'] as const) {
		await inTheme(page, theme);
		await drawingShot(page, `docs/images/own-marks-${theme}.png`);
	}
	await inTheme(page, 'light');

	// The comparison draws both revisions with the same marks.
	const saved = await page.request.put(`/api/sheets/${id}/revisions`, {
		data: { baseRevision: 1, document: probe('9.1M'), message: 'Rt 9.1M' }
	});
	expect(saved.status()).toBe(201);
	await page.goto(`/sheets/${id}/compare?from=1&to=2`);
	for (const name of [/Revision 1 \(older\)/, /Revision 2 \(newer\)/])
		await expectOwnMarks(page.getByRole('figure', { name }));

	// The report's schematic: the same marks, values with their units.
	await page.goto(`/sheets/${id}/report?revision=2`);
	const schematic = page.getByRole('img', { name: /Schematic of the network/ });
	await expectOwnMarks(schematic);
	await expect(schematic).toContainText('50 Ω');
	await expect(schematic).toContainText('9.1 MΩ');
	await expect(schematic).toContainText('90 pF');
});
