// The revision comparison draws both revisions with the changed parts outlined (a badge shape,
// an outline style and words as well as a colour) and judges the sheet's spec limits on both.
// RC low-pass, closed forms: −3 dB at 1/(2πRC) with R the Thevenin resistance seen by C —
// 1 kΩ ∥ 1 MΩ = 999 Ω gives 159.3 kHz; 2 kΩ gives 79.58 kHz (C2 across the ideal source does
// nothing). DC gain RL/(R1 + RL) = 0.999, then 1.
import { expect, test } from '@playwright/test';
import { newSheet, signUpFresh } from './editor-helpers';
import { artifact } from './artifacts';

const rc = (r: string, extra: object[] = []) => ({
	schema: 1,
	elements: [
		{ id: 'V1', type: 'V', nodes: ['in', 'gnd'], value: 1 },
		{ id: 'R1', type: 'R', nodes: ['in', 'out'], value: r },
		{ id: 'C1', type: 'C', nodes: ['out', 'gnd'], value: '1n' },
		...extra
	],
	input: 'V1',
	output: { node: 'out' }
});

test('compare: both drawings with added, removed and changed parts marked; spec verdicts before and after', async ({
	page
}) => {
	await page.setViewportSize({ width: 1400, height: 1000 });
	await signUpFresh(page, 'Ilse Marangoni');
	// Revision 1 has a load resistor RL; revision 2 drops it, doubles R1 and adds C2 across the input.
	const sheetId = await newSheet(
		page,
		rc('1k', [{ id: 'RL', type: 'R', nodes: ['out', 'gnd'], value: '1M' }]),
		'Compare drawing RC'
	);
	const saved = await page.request.put(`/api/sheets/${sheetId}/revisions`, {
		data: {
			baseRevision: 1,
			document: rc('2k', [{ id: 'C2', type: 'C', nodes: ['in', 'gnd'], value: '10p' }]),
			message: 'R1 doubled, RL out, C2 in'
		}
	});
	expect(saved.status()).toBe(201);
	const settings = await page.request.put(`/api/design/sheets/${sheetId}/settings`, {
		data: { spec: { bandwidthMin: 100e3, dcGain: { min: 0.99, max: 1.01 } } }
	});
	expect(settings.status()).toBe(200);

	await page.goto(`/sheets/${sheetId}/compare?from=1&to=2`);
	const older = page.getByRole('figure', { name: /Revision 1 \(older\)/ });
	const newer = page.getByRole('figure', { name: /Revision 2 \(newer\)/ });
	// Older drawing: RL removed, R1 changed (with its new value); nothing marked as added.
	await expect(older.locator('[data-part="RL"]')).toHaveAttribute('data-mark', 'removed');
	await expect(older.locator('[data-part="RL"]')).toContainText('removed');
	await expect(older.locator('[data-part="R1"]')).toContainText('changed: → 2 kΩ');
	await expect(older.locator('[data-mark="added"]')).toHaveCount(0);
	// Newer drawing: C2 added, R1 changed (with its old value); C1 and V1 untouched.
	await expect(newer.locator('[data-part="C2"]')).toHaveAttribute('data-mark', 'added');
	await expect(newer.locator('[data-part="R1"]')).toContainText('changed: was 1 kΩ');
	await expect(newer.locator('[data-part="C1"], [data-part="V1"]')).toHaveCount(0);
	await expect(newer.locator('[data-mark="removed"]')).toHaveCount(0);

	// Spec: bandwidth ≥ 100 kHz met at 159.3 kHz, missed at 79.6 kHz; DC gain 1 met on both.
	const spec = page.getByRole('table', { name: 'Spec limits before and after' });
	const bw = spec.locator('[data-spec="bandwidth"]');
	await expect(bw).toContainText('≥ 100 kHz');
	await expect(bw).toContainText('159.3 kHz');
	await expect(bw).toContainText('79.58 kHz');
	await expect(bw.getByTestId('verdict')).toHaveText(['✓ meets', '✗ misses']);
	await expect(bw.getByTestId('turn')).toHaveText('▼ now misses');
	await expect(spec.locator('[data-spec="dcGain"]').getByTestId('verdict')).toHaveText([
		'✓ meets',
		'✓ meets'
	]);
	await expect(spec.getByTestId('spec-before')).toHaveText('✓ meets all');
	await expect(spec.getByTestId('spec-after')).toHaveText('✗ misses');
	await page.screenshot({ path: artifact('review-compare-drawing.png'), fullPage: true });
	// The outlines and badges must read on the dark palette too.
	await page.evaluate(() => (document.documentElement.dataset.theme = 'dark'));
	await page
		.getByTestId('change-drawings')
		.screenshot({ path: artifact('review-compare-drawing-dark.png') });
});
