// The screens issue 16 changed, as a designer and a reviewer meet them, in light and dark, for
// docs/images: the sheet list with review states, the history as checkpoints (one marked with
// Ctrl+S), the sign-off's confirming step, a tolerance run without spec limits (no yield; a split
// figure shown as its clusters), the report, and a negative value flagged in the editor. Each
// screen is checked for what it must say before it is taken.
import { execFileSync } from 'node:child_process';
import { readdirSync, rmSync } from 'node:fs';
import path from 'node:path';
import { expect, test, type Browser, type Page } from '@playwright/test';
import { artifact } from './artifacts';
import { signInAs } from './exchange-support';
import { analysis, drawingShot, node, openSheet, setValue } from './editor-helpers';

const THEMES = ['light', 'dark'] as const;

// The 10:1 probe divider, compensated: Rt·Ct = Rin·Cin (9 MΩ · 10 pF = 1 MΩ · 90 pF), from 50 Ω
// (common practice). With Ct ±20 % (uniform) the step's first edge reaches Ct/(Ct + Cin) of its
// final value divided by 0.1: above 90 % when Ct > 8.9 pF (a fast rise, the edge), below it
// otherwise (the rise waits for the slow tail) — two clusters, nanoseconds against microseconds.
const divider = (ct = '10p') => ({
	schema: 1,
	elements: [
		{ id: 'Vin', type: 'V', nodes: ['src', 'gnd'], value: 1 },
		{ id: 'Rsrc', type: 'R', nodes: ['src', 'tip'], value: '50' },
		{ id: 'Rt', type: 'R', nodes: ['tip', 'adc'], value: '9M' },
		{ id: 'Ct', type: 'C', nodes: ['tip', 'adc'], value: ct },
		{ id: 'Rin', type: 'R', nodes: ['adc', 'gnd'], value: '1M' },
		{ id: 'Cin', type: 'C', nodes: ['adc', 'gnd'], value: '90p' }
	],
	input: 'Vin',
	output: { node: 'adc' }
});

async function theme(page: Page, t: (typeof THEMES)[number]) {
	await page.evaluate((v) => (document.documentElement.dataset.theme = v), t);
}

async function workspaceWithSheets(page: Page) {
	const ws = await page.request.post('/api/workspaces', {
		data: { name: `Kestrel Ridge front ends ${Date.now()}` }
	});
	expect(ws.status()).toBe(201);
	const { workspace } = await ws.json();
	const make = async (name: string, ct = '10p') => {
		const r = await page.request.post(`/api/workspaces/${workspace.id}/sheets`, {
			data: { name, document: divider(ct) }
		});
		expect(r.status()).toBe(201);
		return (await r.json()).sheet.id as string;
	};
	return { workspaceId: workspace.id as string, make };
}

async function reviewer(browser: Browser) {
	const context = await browser.newContext({ viewport: { width: 1440, height: 1000 } });
	const page = await context.newPage();
	await signInAs(page, 'reviewer');
	return page;
}

async function ask(page: Page, sheetId: string) {
	const grant = await page.request.post(`/api/sheets/${sheetId}/grants`, {
		data: { email: 'reviewer@polewise.test', role: 'commenter' }
	});
	expect(grant.status()).toBe(201);
	const asked = await page.request.post(`/api/sheets/${sheetId}/reviews`, {
		data: { reviewers: ['reviewer@polewise.test'], message: 'Compensation of the tip, please.' }
	});
	expect(asked.status()).toBe(201);
	return (await asked.json()).request.id as string;
}

test('sheet list with review states, history as checkpoints, the sign-off step', async ({
	page,
	browser
}) => {
	test.setTimeout(150_000);
	await page.setViewportSize({ width: 1440, height: 1000 });
	await signInAs(page);
	const { workspaceId, make } = await workspaceWithSheets(page);
	await make('Probe 10:1 — first idea');
	const waiting = await make('Probe 10:1 — bench 2');
	const signed = await make('Probe 10:1 — bench 1');
	const b = await reviewer(browser);

	// "Signed off", then changed: the list says so in the sheet page's words.
	const signedRequest = await ask(page, signed);
	const answer = await b.request.post(`/api/sheets/${signed}/reviews/${signedRequest}/answer`, {
		data: { decision: 'approve', summary: 'Arms match within 1 %; tip compensated.' }
	});
	expect(answer.status()).toBe(200);
	// Four quick saves by one person: one checkpoint, worded by what changed.
	for (const [base, ct] of [
		[1, '10.5p'],
		[2, '9.8p'],
		[3, '10.1p'],
		[4, '10.2p']
	] as const) {
		const saved = await page.request.put(`/api/sheets/${signed}/revisions`, {
			data: { baseRevision: base, document: divider(ct) }
		});
		expect(saved.status()).toBe(201);
	}
	await ask(page, waiting);

	await page.goto(`/workspaces/${workspaceId}`);
	const row = (name: string) => page.getByRole('row', { name: new RegExp(name) });
	await expect(row('bench 1')).toContainText('Signed off — revision 1, changed since sign-off');
	await expect(row('bench 2')).toContainText('With reviewers');
	await expect(row('first idea')).toContainText('Not yet sent for review');
	for (const t of THEMES) {
		await theme(page, t);
		await page.screenshot({ path: `docs/images/sheet-list-${t}.png` });
	}

	// The history: the signed-off revision stands alone; the four saves after it are one
	// checkpoint that says what changed.
	await openSheet(page, signed);
	const history = page.getByRole('list', { name: 'Checkpoints' });
	await expect(history.getByTestId('checkpoint')).toHaveCount(2);
	await expect(history.getByTestId('checkpoint').first()).toContainText('4 saves (revisions 2–5)');
	await expect(history.getByTestId('checkpoint-refs')).toContainText('review');
	// The explicit save: Ctrl+S opens "Mark a checkpoint"; the name lands on revision 5.
	await page.locator('body').press('Control+s');
	const form = page.getByRole('form', { name: 'Mark a checkpoint' });
	await expect(form.getByLabel('Name')).toBeFocused();
	await form.getByLabel('Name').fill('bench 1 as built');
	await form.getByLabel('Message').fill('Ct trimmed to 10.2 pF on the bench');
	await form.getByRole('button', { name: 'Mark checkpoint' }).click();
	await expect(page.getByTestId('checkpoint-said')).toHaveText(
		'Checkpoint: revision 5 “bench 1 as built”'
	);
	await expect(history.getByTestId('checkpoint-name').first()).toHaveText('bench 1 as built');
	await expect(history.getByTestId('checkpoint').first()).toContainText(
		'Ct trimmed to 10.2 pF on the bench'
	);
	for (const t of THEMES) {
		await theme(page, t);
		const section = page.locator('section', { has: page.locator('#history-heading') });
		await section.scrollIntoViewIfNeeded();
		await section.screenshot({ path: `docs/images/history-checkpoints-${t}.png` });
	}

	// The reviewer's sign-off: a summary is needed, then a second, confirming step.
	await openSheet(b, waiting);
	const mine = b.getByRole('region', { name: 'Your review' });
	await mine.getByLabel(/Summary/).fill('Compensated: Rt·Ct = Rin·Cin; overshoot 0 %.');
	await mine.getByRole('button', { name: 'Sign off revision 1…' }).click();
	await expect(mine.getByTestId('confirm-sign-off')).toBeVisible();
	for (const t of THEMES) {
		await theme(b, t);
		await b.locator('#review-panel').screenshot({ path: `docs/images/sign-off-confirm-${t}.png` });
	}
	await b.context().close();
});

test('a tolerance run without limits, the report, a negative value in the editor', async ({
	page
}) => {
	test.setTimeout(150_000);
	await page.setViewportSize({ width: 1440, height: 1000 });
	await signInAs(page);
	const { make } = await workspaceWithSheets(page);
	const id = await make('Probe 10:1 — tolerance');
	await openSheet(page, id);

	// Monte Carlo with no spec limits: no yield is claimed, and the rise time that splits into
	// two groups is described by them, not by a mean that no run had.
	const aids = page.getByRole('region', { name: 'Design aids' });
	await aids.getByRole('tab', { name: 'Tolerance runs' }).click();
	await aids.getByLabel('Tolerance of Ct in percent').fill('20');
	await aids.getByLabel('Distribution of Ct').selectOption('uniform');
	await aids.getByLabel('Runs', { exact: true }).fill('400');
	await aids.getByLabel('Seed').fill('7');
	await aids.getByRole('button', { name: 'Run Monte Carlo' }).click();
	await expect(aids.getByTestId('mc-no-yield')).toBeVisible({ timeout: 90_000 });
	await expect(aids.getByTestId('mc-yield')).toHaveCount(0);
	const rise = aids.locator('[data-testid="mc-summary"][data-figure="riseTime"]');
	await expect(rise).toHaveAttribute('data-clusters', '2');
	await expect(rise).toContainText('Not one population');
	for (const t of THEMES) {
		await theme(page, t);
		await aids.scrollIntoViewIfNeeded();
		await aids.screenshot({ path: `docs/images/tolerance-no-limits-${t}.png` });
	}
	await theme(page, 'light');

	// A negative resistor is accepted but flagged on the symbol and in the panel.
	await setValue(page, 'Rsrc', '-50');
	await expect(node(page, 'Rsrc').getByTestId('value-warning')).toContainText('negative');
	// −50 Ω puts a pole in the right half-plane, and the status line says so.
	await expect(analysis(page).getByRole('status').first()).toContainText('right half-plane');
	for (const t of THEMES) {
		await theme(page, t);
		await drawingShot(page, `docs/images/editor-input-${t}.png`);
	}
	await setValue(page, 'Rsrc', '50');
	await expect(page.locator('[data-save-status]')).toHaveAttribute('data-save-status', 'saved', {
		timeout: 15_000
	});

	// The report on screen (its PDF is checked in exchange-report.test.ts).
	await page.setViewportSize({ width: 1100, height: 1000 });
	await page.goto(`/sheets/${id}/report`);
	await expect(page.getByRole('img', { name: /Schematic of the network/ })).toContainText('50 Ω');
	await expect(page.getByRole('img', { name: /Schematic of the network/ })).toContainText(
		'▸ drives H(s)'
	);
	for (const t of THEMES) {
		await theme(page, t);
		await page.screenshot({ path: `docs/images/report-${t}.png`, fullPage: true });
	}
	// Its PDF, page by page as printed (paper is light whatever the screen's theme).
	const [download] = await Promise.all([
		page.waitForEvent('download', { timeout: 60_000 }),
		page.getByRole('link', { name: 'Download PDF' }).click()
	]);
	const pdf = artifact('report.pdf');
	await download.saveAs(pdf);
	for (const f of readdirSync('docs/images').filter((f) => f.startsWith('report-pdf-')))
		rmSync(path.join('docs/images', f));
	execFileSync('pdftoppm', ['-png', '-r', '60', pdf, 'docs/images/report-pdf']);
	expect(
		readdirSync('docs/images').filter((f) => f.startsWith('report-pdf-')).length
	).toBeGreaterThan(1);
});
