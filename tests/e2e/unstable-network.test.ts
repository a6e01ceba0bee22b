// A network made unstable by an edit (a negative source resistance: a pole in the right half-
// plane). Its step response runs out of the range of a double, those samples arrive as null, and
// the step plot's data table threw on them — which stopped the whole results panel from updating:
// the key figures kept the stable network's rise and settling times beside the "unstable" note.
import { expect, test } from '@playwright/test';
import { readFileSync } from 'node:fs';
import { newSheet, openSheet, setValue, signUpFresh } from './editor-helpers';

test('an edit that makes the network unstable clears its step figures and breaks nothing', async ({ page }) => {
	const errors: string[] = [];
	page.on('pageerror', (e) => errors.push(e.message));
	await page.setViewportSize({ width: 1440, height: 1000 });
	await signUpFresh(page);
	const doc = JSON.parse(readFileSync('docs/examples/probe-10x.json', 'utf8'));
	await openSheet(page, await newSheet(page, doc, 'Made unstable'));
	const results = page.getByRole('region', { name: 'Analysis', exact: true });
	const figure = (name: string) =>
		results.locator('dl > div').filter({ hasText: name }).locator('dd');
	await expect(figure('Rise time')).not.toHaveText('—');

	await setValue(page, 'Rsrc', '-50');
	await expect(results.getByRole('status').first()).toContainText('right half-plane');
	for (const name of ['Rise time', 'Overshoot', 'Settling']) await expect(figure(name)).toHaveText('—');
	// The step plot still draws what is finite, and its data table opens.
	await expect(results.getByRole('heading', { name: 'Step response' })).toBeVisible();
	expect(errors).toEqual([]);
});
