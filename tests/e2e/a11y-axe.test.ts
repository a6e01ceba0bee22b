// Every page, in the light and the dark theme, checked by axe-core against the WCAG 2.0/2.1 A and
// AA rules (plus the label-in-name rule, which axe ships as experimental). The bar is zero
// violations; an exception would be listed in EXCEPTIONS with its reason (there is none).
import { AxeBuilder } from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { demoSheets } from '../../src/lib/server/db/seed/demo-sheets';
import { newSheet, signUpFresh } from './editor-helpers';

const TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'];
/** Rule ids allowed to fail, each with the reason. None today. */
const EXCEPTIONS: Record<string, string> = {};
// A well-formed token that matches no invitation or link: the "not valid" pages.
const NO_TOKEN = 'a'.repeat(52);

async function audit(page: Page, what: string) {
	const result = await new AxeBuilder({ page })
		.options({
			runOnly: { type: 'tag', values: TAGS },
			rules: { 'label-content-name-mismatch': { enabled: true } }
		})
		.analyze();
	const found = result.violations
		.filter((v) => !EXCEPTIONS[v.id])
		.map((v) => ({
			rule: v.id,
			impact: v.impact,
			nodes: v.nodes.slice(0, 5).map((n) => `${n.target.join(' ')} — ${n.failureSummary}`)
		}));
	expect(found, `axe on ${what}`).toEqual([]);
}

/** Open a page (server-rendered: what axe checks is there once it has loaded). */
async function visit(page: Page, url: string) {
	await page.goto(url);
}

async function visitSheet(page: Page, url: string) {
	await visit(page, url);
	await expect(page.locator('[data-analysis-status="done"]')).toBeVisible();
	await expect(page.getByRole('application', { name: /Schematic canvas/ })).toBeVisible();
	// The design aids and data panels load after the first results.
	await expect(page.getByRole('heading', { name: 'Measured responses' })).toBeVisible();
	// So do the variants side by side (the demo divider has six): audited once they are there.
	await expect(page.getByTestId('variant-figures')).toBeVisible();
	await expect(page.getByTestId('variant-responses')).toBeVisible();
}

for (const theme of ['light', 'dark'] as const) {
	test(`axe-core finds no WCAG 2.1 A/AA violation on any page, ${theme} theme`, async ({
		page,
		context,
		baseURL
	}) => {
		test.setTimeout(240_000);
		await page.setViewportSize({ width: 1440, height: 1000 });
		await context.addCookies([{ name: 'pw-theme', value: theme, url: baseURL! }]);

		for (const url of ['/', '/credits', '/sign-in', '/sign-up', '/forgot-password']) {
			await visit(page, url);
			await audit(page, `${url} (${theme})`);
		}
		await visit(page, `/reset-password/${NO_TOKEN}`);
		await audit(page, `reset password, unknown token (${theme})`);
		await visit(page, `/sign-up/${NO_TOKEN}`);
		await audit(page, `sign-up link, unknown token (${theme})`);

		await signUpFresh(page, 'Ines Okafor');
		const demo = demoSheets[0];
		const sheetId = await newSheet(page, demo.document, demo.name);
		const sheet = `/sheets/${sheetId}`;
		// A second revision, so the comparison page has two to compare.
		const changed = {
			...demo.document,
			elements: demo.document.elements.map((e, i) => (i === 0 ? { ...e, value: '60' } : e))
		};
		const saved = await page.request.put(`/api/sheets/${sheetId}/revisions`, {
			data: { document: changed, baseRevision: 1 }
		});
		expect(saved.status()).toBe(201);
		const { workspaces } = await (await page.request.get('/api/workspaces')).json();
		const ws = `/workspaces/${workspaces[0].id}`;
		const meeting = await page.request.post('/api/meetings', {
			data: { workspaceId: workspaces[0].id, title: 'Front-end review', heldOn: '2026-12-04' }
		});
		expect(meeting.status()).toBe(201);
		const meetingId = (await meeting.json()).meeting.id;
		expect(
			(await page.request.post(`/api/meetings/${meetingId}/items`, { data: { sheetId } })).status()
		).toBe(201);

		for (const url of [
			'/workspaces',
			ws,
			`${ws}/trash`,
			`${ws}/settings`,
			`${ws}/audit`,
			`${ws}/meetings`,
			`${ws}/meetings/${meetingId}`,
			`${ws}/meetings/${meetingId}/walk/1`,
			`${ws}/meetings/${meetingId}/summary`,
			'/account',
			'/notifications',
			'/sign-out',
			`${sheet}/report`,
			`${sheet}/compare?from=1&to=2`,
			`/invitations/${NO_TOKEN}`
		]) {
			await visit(page, url);
			await audit(page, `${url} (${theme})`);
		}

		await visitSheet(page, sheet);
		await audit(page, `sheet page (${theme})`);
		// The keys panel open over the editor.
		await page.getByRole('button', { name: /Keys/ }).click();
		await expect(page.getByRole('dialog')).toBeVisible();
		await audit(page, `sheet page with the keys panel (${theme})`);
		await page.keyboard.press('Escape');
		// An older revision, read-only.
		await visitSheet(page, `${sheet}?revision=1`);
		await audit(page, `sheet page, old revision (${theme})`);

		// A read-only link, opened without a session.
		await visit(page, sheet);
		await page.getByRole('button', { name: 'Make link' }).click();
		const link = await page.getByLabel('New link').inputValue();
		await context.clearCookies();
		await context.addCookies([{ name: 'pw-theme', value: theme, url: baseURL! }]);
		await visit(page, new URL(link).pathname);
		await expect(page.locator('[data-analysis-status="done"]')).toBeVisible();
		await audit(page, `read-only link (${theme})`);
	});
}
