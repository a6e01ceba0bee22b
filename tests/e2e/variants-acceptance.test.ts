// The acceptance on the lab's divider: three range positions and two cable options as
// one sheet, all six variants side by side with the specs across them; solving the compensation
// of every range position at once makes "the same input capacitance in every position" hold on
// the 1.2 m cable (closed form: C_top in series with the shunt, 6.0 pF in each position).
import { expect, test } from '@playwright/test';
import { analysis, newSheet, openSheet, signUpFresh } from './editor-helpers';
import { digitizerDividerRanges, dividerSettings } from '../../src/lib/server/db/seed/demo-sheets';

test('six variants side by side, specs across them, compensation solved per position', async ({
	page
}) => {
	test.setTimeout(120_000);
	await signUpFresh(page, 'Mira Okonkwo');
	const id = await newSheet(page, digitizerDividerRanges, 'Divider, three ranges');
	const put = await page.request.put(`/api/design/sheets/${id}/settings`, {
		data: dividerSettings
	});
	expect(put.status()).toBe(200);
	await openSheet(page, id);
	await expect(analysis(page)).toHaveAttribute('data-analysis-status', 'done');

	const table = page.getByTestId('variant-figures');
	await expect(table.locator('tbody tr')).toHaveCount(6);
	await expect(table).toContainText('1000:1 · 2 m cable');
	// Each variant's dominant pole with its estimate, the estimate naming its method.
	const estimates = page.getByTestId('variant-poles').getByTestId('variant-estimate');
	await expect(estimates).toHaveCount(12);
	// Edges in picoseconds, tails in microseconds: the overlaid steps are on a log time axis.
	await expect(
		page.getByRole('img', { name: /Step responses of 6 variants, overlaid, logarithmic/ })
	).toBeVisible();
	for (const text of await estimates.allInnerTexts())
		expect(text).toMatch(/%\)\s*(1\/b1|coefficient ratio|root of|sequential)/);
	const cross = page.getByTestId('cross-spec-live').getByTestId('cross-spec');
	const cinRow = cross
		.locator('tr', { hasText: '1.2 m cable' })
		.filter({ hasText: 'Input capacitance' });
	// As seeded the tops are off (6.8 p, 6.2 p, 5.6 p): 5.6–6.1 pF across the positions.
	await expect(cinRow).toContainText('does not hold');
	await expect(cross.locator('tr', { hasText: 'Attenuation' }).first()).toContainText('holds');
	// The long lists of values wrap: the outcome column is on screen, not in a scroll box.
	expect(await cross.evaluate((t) => t.scrollWidth <= t.parentElement!.clientWidth)).toBe(true);

	// Solve Ctop for a flat response in every range position and write each into its position.
	const aids = page.getByRole('region', { name: 'Design aids' });
	await aids.getByLabel('Element to adjust').selectOption('Ctop');
	await aids.getByLabel('Goal').selectOption('flat');
	await aids.getByRole('button', { name: 'Solve in every Range' }).click();
	const solved = aids.getByTestId('solve-every-option');
	await expect(solved.locator('tbody tr')).toHaveCount(3);
	// Closed form R_top·C_top = R_shunt·C_shunt: 6.667 pF, 6.06 pF, 6.006 pF.
	await expect(solved.locator('tr', { hasText: '100:1' })).toContainText(/6\.06\d* pF/);
	await aids.getByRole('button', { name: 'Apply every Range value' }).click();
	await expect(page.getByTestId('variant-overrides')).toContainText(/Ctop = 6\.666/);

	// Saved, re-analysed and judged again: the 1.2 m cable's positions now agree.
	await expect(page.getByText(/Saved · revision 2/)).toBeVisible({ timeout: 20_000 });
	await expect(cinRow).toContainText('holds', { timeout: 20_000 });
	await expect(cinRow).not.toContainText('does not hold');
	// A sign-off of this revision covers all six (the review panel says so).
	await page.reload();
	await expect(page.getByTestId('review-covers')).toContainText('all 6 variants');
});

// One sign-off covers every variant of the revision: a reviewer signs off the six-variant sheet
// once, sees beforehand that the answer covers all six (and how each fares against the specs),
// and a later change to one position's override alone marks the sheet as changed since sign-off.
test('one sign-off covers all six variants; changing one position’s override undoes it', async ({
	browser
}) => {
	test.setTimeout(120_000);
	const ctxA = await browser.newContext({ viewport: { width: 1440, height: 1000 } });
	const ctxB = await browser.newContext({ viewport: { width: 1440, height: 1000 } });
	const [a, b] = [await ctxA.newPage(), await ctxB.newPage()];
	await signUpFresh(a, 'Mira Okonkwo');
	const id = await newSheet(a, digitizerDividerRanges, 'Divider, three ranges, review');
	expect(
		(await a.request.put(`/api/design/sheets/${id}/settings`, { data: dividerSettings })).status()
	).toBe(200);
	const { email: emailB } = await signUpFresh(b, 'Tomasz Eriksen');
	const shared = await a.request.post(`/api/sheets/${id}/grants`, {
		data: { email: emailB, role: 'commenter' }
	});
	expect(shared.status()).toBe(201);

	const panel = (p: typeof a) => p.getByRole('region', { name: 'Review' });
	await openSheet(a, id);
	await panel(a).getByRole('button', { name: 'Ask for review' }).click();
	const dialog = a.getByRole('dialog', { name: /Ask for a review/ });
	await dialog.getByRole('checkbox', { name: /Tomasz Eriksen/ }).check();
	await dialog.getByRole('button', { name: 'Send request' }).click();
	await expect(panel(a).getByTestId('review-state')).toHaveText(/With reviewers/);

	await openSheet(b, id);
	await expect(b.getByTestId('review-covers')).toContainText('all 6 variants');
	const mine = panel(b).getByRole('region', { name: 'Your review' });
	// The answer says it covers all six, and that the seeded tops miss the input-capacitance spec.
	await expect(mine.getByTestId('answer-variants')).toContainText(
		'covers all 6 variants of revision 1'
	);
	await expect(mine.getByTestId('answer-variants')).toContainText(
		'spec(s) across variants do not hold'
	);
	await mine.getByLabel('Summary').fill('Accepted for all ranges and both cables as drawn.');
	await mine.getByRole('button', { name: 'Sign off revision 1…' }).click();
	await mine.getByRole('button', { name: 'Yes, sign off revision 1' }).click();
	await expect(panel(a).getByTestId('review-state')).toHaveText(/Signed off\s+—\s+revision 1/);

	// Only the 2 m cable's capacitance changes (an override, not the drawing): no longer signed off.
	const doc = structuredClone(digitizerDividerRanges);
	doc.variants.groups[1].options[1].values = { Ccable: '80p' };
	const saved = await a.request.put(`/api/sheets/${id}/revisions`, {
		data: { document: doc, baseRevision: 1 }
	});
	expect(saved.status()).toBe(201);
	await a.reload();
	await expect(panel(a).getByTestId('changed-since-approval')).toContainText(
		'changed since sign-off'
	);
	await ctxA.close();
	await ctxB.close();
});
