// The design aids on the sheet page, in Chromium against the built app: solve the demo
// divider's trimmer and see the flat response, run a seeded Monte Carlo with progress and see
// its yield (also after a reload), snap to E12 and apply the values to the drawing, and work on
// unsaved edits. Each test makes its own sheet.
import { expect, test, type Locator, type Page } from '@playwright/test';
import { newSheet, node, setValue, signIn, signUpFresh } from './editor-helpers';
import { digitizerDivider } from '../../src/lib/server/db/seed/demo-sheets';

const shots = process.env.DESIGN_SHOTS;
// One fresh account for this file (sign-ups are rate limited per address); each test makes its own sheet.
// DESIGN_ACCOUNT=email:password reuses an existing account (screenshots against a dev server).
const given = process.env.DESIGN_ACCOUNT?.split(':');
let account: { email: string; password: string } | null = given
	? { email: given[0], password: given[1] }
	: null;

async function openAids(page: Page) {
	if (account) await signIn(page, account.email, account.password);
	else account = await signUpFresh(page, 'Ines Okafor');
	const id = await newSheet(page, digitizerDivider, 'Divider for design aids');
	await page.goto(`/sheets/${id}`);
	const aids = page.getByRole('region', { name: 'Design aids' });
	await expect(aids.getByTestId('design-source')).toHaveText(
		'on the drawing as it is now (saved as revision 1)'
	);
	return { id, aids };
}

/** Save a flatness limit (± dB from 10 Hz to 1 MHz) with the sheet and check against it. */
async function checkFlatWithin(aids: Locator, withinDb: string) {
	await aids.getByRole('tab', { name: 'Spec limits' }).click();
	await aids.getByLabel('Flat within ± (dB)').fill(withinDb);
	await aids.getByLabel('Flat from (Hz)').fill('10');
	await aids.getByLabel('Flat up to (Hz)').fill('1M');
	await aids.getByRole('button', { name: 'Save limits and check' }).click();
}

test('solve the divider’s trimmer for a flat response', async ({ page }) => {
	const { aids } = await openAids(page);
	await aids.getByLabel('Element to adjust').selectOption('Ctop');
	await aids.getByLabel('Goal').selectOption('flat');
	await aids.getByRole('button', { name: 'Solve' }).click();
	const solved = aids.getByTestId('solved-value');
	// Closed form for the arms: 1 MΩ × (42 + 18) pF / 9 MΩ = 6.667 pF (the 50 Ω source moves it a hair).
	await expect(solved).toContainText(/Ctop = 6\.6\d{2,3} pF/);
	await expect(solved).toContainText('was 6.8 pF');
	await expect(aids.getByRole('img', { name: 'Magnitude before and after' })).toBeVisible();
	await expect(aids.getByRole('cell', { name: /6\.8 pF \(next above\)/ })).toBeVisible();
	if (shots) await aids.screenshot({ path: `${shots}/design-solve.png` });
});

test('a seeded Monte Carlo shows progress and yield, and is still there after a reload', async ({
	page
}) => {
	// A background job on a shared 2-core machine: allow for a slow queue.
	test.setTimeout(120_000);
	const { aids } = await openAids(page);
	await checkFlatWithin(aids, '0.3');
	await expect(aids.getByTestId('spec-verdict')).toHaveText('meets every limit');
	await aids.getByRole('tab', { name: 'Tolerance runs' }).click();
	await aids.getByLabel('Tolerance of Ctop in percent').fill('10');
	await aids.getByLabel('Runs', { exact: true }).fill('1500');
	await aids.getByLabel('Seed').fill('7');
	await aids.getByRole('button', { name: 'Run Monte Carlo' }).click();
	await expect(aids.getByTestId('mc-progress')).toContainText('of 1,500 runs');
	await expect(aids.getByTestId('mc-yield')).toContainText(/Yield \d+\.\d %/, { timeout: 90_000 });
	const yieldText = await aids.getByTestId('mc-yield').textContent();
	await expect(aids.getByTestId('mc-progress')).toContainText(
		'1,500 of 1,500 runs · done · revision 1'
	);
	await expect(
		aids.getByRole('img', { name: 'Histogram of Flatness (worst deviation)' })
	).toBeVisible();
	if (shots) await aids.screenshot({ path: `${shots}/design-tolerance.png` });
	await page.reload();
	await page
		.getByRole('region', { name: 'Design aids' })
		.getByRole('tab', { name: 'Tolerance runs' })
		.click();
	await expect(page.getByTestId('mc-yield')).toHaveText(yieldText!);
});

test('snap every part to E12 and see the effect', async ({ page }) => {
	const { aids } = await openAids(page);
	await aids.getByRole('tab', { name: 'Preferred values' }).click();
	await aids.getByLabel('Series (IEC 60063)').selectOption('E12');
	await aids.getByRole('button', { name: 'Snap to E12' }).click();
	const table = aids.getByRole('table', { name: 'Preferred values' });
	// 9 MΩ is not in E12: its neighbours are 8.2 MΩ and 10 MΩ, nearer 8.2 by ratio (IEC 60063 E12, from memory).
	await expect(table.getByRole('row', { name: /Rtop/ })).toContainText('8.2 MΩ');
	// The cable is a fixed value: not offered for snapping, and said to be left alone.
	await expect(table.getByRole('row', { name: /Ccable/ })).toHaveCount(0);
	await expect(aids.getByTestId('snap-skipped')).toHaveText('Left alone: Ccable (fixed value).');
	await expect(aids.getByTestId('snap-all')).toContainText('All snapped to E12');
	if (shots) await aids.screenshot({ path: `${shots}/design-snap.png` });
});

test('sweep Ctop: pole paths and a table', async ({ page }) => {
	const { aids } = await openAids(page);
	await aids.getByRole('tab', { name: 'Sweep a value' }).click();
	await aids.getByRole('button', { name: 'Sweep' }).click();
	await expect(
		aids.getByRole('img', { name: 'Pole and zero paths as Ctop is swept' })
	).toBeVisible();
	await expect(aids.getByText('41 points in')).toBeVisible();
	if (shots) await aids.screenshot({ path: `${shots}/design-sweep.png` });
	await aids.getByRole('tab', { name: 'Pole sensitivity' }).click();
	await aids.getByRole('button', { name: 'Rank what moves each pole' }).click();
	await expect(aids.getByText(/^Pole 1: /)).toBeVisible();
	if (shots) await aids.screenshot({ path: `${shots}/design-sensitivity.png` });
});

test('apply snapped values to the drawing: one undo step each, saved like any edit', async ({
	page
}) => {
	const { aids } = await openAids(page);
	const saved = page.locator('[data-save-status]');
	await aids.getByRole('tab', { name: 'Preferred values' }).click();
	await aids.getByLabel('Series (IEC 60063)').selectOption('E12');
	await aids.getByRole('button', { name: 'Snap to E12' }).click();
	const table = aids.getByRole('table', { name: 'Preferred values' });
	// 50 Ω is not in E12 (47 and 56 are; IEC 60063 E12, from memory): nearest by ratio is 47 Ω.
	await table.getByRole('button', { name: 'Apply 8.2 MΩ to Rtop' }).click();
	await expect(aids.getByRole('status').filter({ hasText: 'Applied' })).toContainText(
		'Applied to the drawing: Rtop = 8.2 MΩ'
	);
	await expect(node(page, 'Rtop')).toContainText('8.2 MΩ');
	// The table is the drawing now: Rtop is in the series, its effect is gone.
	await expect(table.getByRole('row', { name: /Rtop/ })).toContainText('in E12');
	await expect(saved).toHaveAttribute('data-revision', '2');
	await expect(saved).toHaveAttribute('data-save-status', 'saved');
	await expect(aids.getByTestId('design-source')).toHaveText(
		'on the drawing as it is now (saved as revision 2)'
	);
	if (shots) await aids.screenshot({ path: `${shots}/design-snap-applied.png` });

	await aids.getByRole('button', { name: 'Apply all' }).click();
	await expect(node(page, 'Rsrc')).toContainText('47 Ω');
	// "Apply all" leaves the cable (a fixed value) as it was.
	await expect(node(page, 'Ccable')).toContainText('42 pF');
	await expect(node(page, 'Cadc')).toContainText('18 pF');
	await expect(saved).toHaveAttribute('data-revision', '3');
	// One undo takes the whole "apply all" back, and not the single apply before it.
	await page.getByLabel('Drawing commands').getByRole('button', { name: /Undo/ }).click();
	await expect(node(page, 'Rsrc')).toContainText('50 Ω');
	await expect(node(page, 'Ccable')).toContainText('42 pF');
	await expect(node(page, 'Rtop')).toContainText('8.2 MΩ');
	await expect(saved).toHaveAttribute('data-revision', '4');
	// The table knows the drawing changed under it.
	await expect(aids.getByText('The drawing’s values have changed since')).toBeVisible();
	await expect(aids.getByRole('button', { name: 'Apply all' })).toBeDisabled();
	await page.reload();
	await expect(node(page, 'Rtop')).toContainText('8.2 MΩ');
	await expect(node(page, 'Ccable')).toContainText('42 pF');
});

test('the aids run on unsaved edits and say so', async ({ page }) => {
	const { aids } = await openAids(page);
	// Hold every save back: the edit below stays unsaved for the whole test.
	await page.route('**/api/sheets/*/revisions', (route) => route.abort());
	await setValue(page, 'Ctop', '6.6667p');
	await expect(node(page, 'Ctop')).toContainText('6.6667 pF');
	await expect(aids.getByTestId('design-source')).toHaveText(
		'on the drawing as it is now (unsaved edits on revision 1)'
	);
	await checkFlatWithin(aids, '0.05');
	// Saved revision 1 (6.8 pF) lifts 0.17 dB and fails; the drawing, at the compensating
	// 6.6667 pF (1 MΩ × 60 pF / 9 MΩ, closed form), is flat.
	await expect(aids.getByTestId('spec-verdict')).toHaveText('meets every limit');
	await expect(
		aids.getByText('On the drawing as it is now (unsaved edits on revision 1):')
	).toBeVisible();
	if (shots) await aids.screenshot({ path: `${shots}/design-unsaved.png` });
	await aids.getByRole('tab', { name: 'Solve for a value' }).click();
	await aids.getByLabel('Element to adjust').selectOption('Ctop');
	await aids.getByRole('button', { name: 'Solve' }).click();
	await expect(aids.getByTestId('solved-value')).toContainText(/was 6\.667 pF/);
	// A half-typed value is named, not sent.
	await setValue(page, 'Ctop', '6.6q');
	await expect(aids.getByText(/The drawing cannot be analysed yet \(Ctop:/)).toBeVisible();
});

test('limits typed while the saved ones are still loading are kept', async ({ page }) => {
	const { aids } = await openAids(page);
	// Hold the saved limits back until a value has been typed, as a slow server would.
	let release!: () => void;
	const held = new Promise<void>((resolve) => (release = resolve));
	await page.route('**/api/design/sheets/*/settings', async (route) => {
		if (route.request().method() === 'GET') await held;
		await route.continue();
	});
	const loaded = page.waitForResponse(
		(r) => r.url().endsWith('/settings') && r.request().method() === 'GET'
	);
	await aids.getByRole('tab', { name: 'Spec limits' }).click();
	const field = aids.getByLabel('Flat within ± (dB)');
	await field.fill('0.05');
	release();
	await loaded;
	// Let the panel apply what it loaded, then the typed value must still be there.
	await page.evaluate(() => new Promise((resolve) => setTimeout(resolve, 100)));
	await expect(field).toHaveValue('0.05');
	await expect(aids.getByLabel('Flat from (Hz)')).toHaveValue('');
});
