// The comparison page says changes a reviewer can trust (issue 16, item 6): values with their
// units, absolute changes where a figure is at or near zero (never "−100 %" for a settling time
// that went to 0), and figures that appear or disappear said in words. Screenshots of the page
// in light and dark go to docs/images.
import { expect, test } from '@playwright/test';
import { newSheet, signUpFresh } from './editor-helpers';

// High-pass C1 → R1; then R2 across C1 (a DC path: gain R1/(R1 + R2) = 0.5, closed form); then
// C1 removed (a resistive divider: the step settles at once).
const doc = (withR2: boolean, withC: boolean) => ({
	schema: 1,
	elements: [
		{ id: 'Vin', type: 'V', nodes: ['in', 'gnd'], value: 1 },
		...(withC ? [{ id: 'Ccpl', type: 'C', nodes: ['in', 'out'], value: '6.8p' }] : []),
		{ id: 'Rload', type: 'R', nodes: ['out', 'gnd'], value: '1k' },
		...(withR2 ? [{ id: 'Rbias', type: 'R', nodes: ['in', 'out'], value: '1k' }] : [])
	],
	input: 'Vin',
	output: { node: 'out' }
});

test('compare: units on every value, absolute changes at zero, appearing figures in words', async ({
	page
}) => {
	await page.setViewportSize({ width: 1440, height: 1000 });
	await signUpFresh(page, 'Ilse Marangoni');
	const sheetId = await newSheet(page, doc(false, true), 'Coupling network');
	for (const [base, d, message] of [
		[1, doc(true, true), 'Rbias across the coupling capacitor'],
		[2, doc(true, false), 'Ccpl out']
	] as const) {
		const saved = await page.request.put(`/api/sheets/${sheetId}/revisions`, {
			data: { baseRevision: base, document: d, message }
		});
		expect(saved.status()).toBe(201);
	}

	await page.goto(`/sheets/${sheetId}/compare?from=1&to=2`);
	const figures = page.getByTestId('figure-changes');
	const row = (key: string) => figures.locator(`[data-figure="${key}"]`);
	await expect(row('dcGain')).toContainText('0 V/V');
	await expect(row('dcGain')).toContainText('0.5 V/V (−6.02 dB)');
	await expect(row('dcGain').getByTestId('figure-change')).toHaveText('+0.5 V/V');
	await expect(row('riseTime').getByTestId('figure-change')).toHaveText('appears in revision 2');
	await expect(row('settlingTime')).toContainText('none');
	await expect(row('bandwidth').getByTestId('figure-change')).toHaveText('none on either side');
	await expect(row('highFrequencyGain').getByTestId('figure-change')).toHaveText('no change');
	// The added part's value carries its unit.
	await expect(page.getByTestId('element-changes')).toContainText('1 kΩ');
	await page.screenshot({ path: 'docs/images/compare-changes-light.png', fullPage: true });

	await page.goto(`/sheets/${sheetId}/compare?from=2&to=3`);
	const settle = row('settlingTime').getByTestId('figure-change');
	await expect(settle).toHaveAttribute('data-kind', 'absolute');
	// τ = (Rload ∥ Rbias)·Ccpl = 500 Ω · 6.8 pF = 3.4 ns; the step's error decays from 1 to 1 %
	// of it in τ·ln 100 = 15.66 ns (closed form), and the divider without Ccpl settles at once.
	await expect(settle).toHaveText('−15.66 ns');
	await expect(page.getByTestId('element-changes')).toContainText('6.8 pF');
	await expect(page.getByTestId('p-movement').getByTestId('movement')).toHaveText(
		'gone in revision 3'
	);
	await page.evaluate(() => (document.documentElement.dataset.theme = 'dark'));
	await page.screenshot({ path: 'docs/images/compare-changes-dark.png', fullPage: true });
});
