// "Import a sheet file" on the workspace page: a file the analyzer refuses is named by element
// and creates nothing; an exported sheet file becomes a new sheet of the workspace, and the
// browser goes to it.
import { expect, test } from '@playwright/test';
import { probe, sheetWith, signInAs } from './exchange-support';
import { artifact } from './artifacts';

test('workspace import: refused file names the element and creates nothing; a good one opens as a new sheet', async ({
	page
}) => {
	await signInAs(page);
	const { sheetId, workspaceId } = await sheetWith(page, probe, 'Probe 10:1, bench A');
	const exported = await (await page.request.get(`/api/sheets/${sheetId}/export`)).text();
	await page.goto(`/workspaces/${workspaceId}`);
	await page.waitForLoadState('networkidle');
	const count = page.getByRole('heading', { name: /^Sheets/ });
	await expect(count).toHaveText('Sheets (1)');
	const box = page.getByRole('region', { name: 'Import a sheet file' });

	const bad = {
		...probe,
		elements: probe.elements.map((e) => (e.id === 'Ct' ? { ...e, value: '10 pico' } : e))
	};
	await box.getByLabel('Sheet file').setInputFiles({
		name: 'probe-typo.json',
		mimeType: 'application/json',
		buffer: Buffer.from(JSON.stringify(bad))
	});
	await box.getByLabel(/^Name/).fill('Probe with a typo');
	await box.getByRole('button', { name: 'Import as a new sheet' }).click();
	// The analyzer's own words, naming the element; the name typed stays.
	await expect(
		box.getByText(
			'The file was not imported: element "Ct": value "10 pico" is not a number with an SI prefix.'
		)
	).toBeVisible();
	await expect(box.getByLabel(/^Name/)).toHaveValue('Probe with a typo');
	await expect(count).toHaveText('Sheets (1)');
	await page.screenshot({ path: artifact('workspace-import-refused.png'), fullPage: true });

	await box.getByLabel('Sheet file').setInputFiles({
		name: 'probe-10-1-r1.polewise.json',
		mimeType: 'application/json',
		buffer: Buffer.from(exported)
	});
	await box.getByLabel(/^Name/).fill('Probe 10:1, bench B');
	await box.getByRole('button', { name: 'Import as a new sheet' }).click();
	await page.waitForURL((u) => u.pathname.startsWith('/sheets/') && !u.pathname.includes(sheetId));
	await expect(page.getByRole('heading', { level: 1 })).toHaveText('Probe 10:1, bench B');
	await page.goto(`/workspaces/${workspaceId}`);
	await expect(count).toHaveText('Sheets (2)');
});
