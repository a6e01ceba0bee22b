// The Touchstone dialog on the sheet page: choosing the 2.0 layout downloads a file with the
// keywords of the Touchstone File Format Specification Version 2.0 (IBIS Open Forum, 2009) and
// Z in ohms: for the RC low-pass between its input and output node pairs, Z21 at 1 kHz is the
// shunt capacitor's 1/(jωC) seen from both ports (closed form; the series R does not enter Z21).
import { readFileSync } from 'node:fs';
import { expect, test } from '@playwright/test';
import { lowPass, sheetWith, signInAs } from './exchange-support';
import { artifact } from './artifacts';

test('Touchstone dialog: the 2.0 layout downloads with its keywords, Z in ohms', async ({
	page
}) => {
	await signInAs(page);
	const { sheetId } = await sheetWith(page, lowPass, 'RC low-pass, two-port');
	await page.goto(`/sheets/${sheetId}`);
	await page.waitForLoadState('networkidle');
	await page.getByRole('button', { name: 'Touchstone two-port…' }).click();
	const dialog = page.getByRole('dialog', { name: 'Touchstone two-port (.s2p)' });
	await dialog.getByLabel('File layout').selectOption('2.0');
	await dialog.getByLabel('Parameters').selectOption('Z');
	await dialog.getByLabel(/^Or a list of frequencies/).fill('1k, 10k');
	await dialog.screenshot({ path: artifact('touchstone-dialog.png') });
	const download = page.waitForEvent('download');
	await dialog.getByRole('button', { name: 'Download .s2p' }).click();
	const file = await download;
	expect(file.suggestedFilename()).toMatch(/\.s2p$/);
	const text = readFileSync((await file.path())!, 'ascii');
	const lines = text.split('\r\n').filter((l) => l && !l.startsWith('!'));
	expect(lines.slice(0, 7)).toEqual([
		'[Version] 2.0',
		'# Hz Z RI R 50',
		'[Number of Ports] 2',
		'[Two-Port Data Order] 21_12',
		'[Number of Frequencies] 2',
		'[Reference] 50 50',
		'[Network Data]'
	]);
	expect(lines.at(-1)).toBe('[End]');
	// 21_12 order: f, Z11, Z21, …; Z21 = 1/(jωC) = −j/(2π·1 kHz·1 nF) ≈ −j159.15 kΩ (closed form).
	const [f, , , z21re, z21im] = lines[7].split(' ').map(Number);
	expect(f).toBe(1000);
	expect(Math.abs(z21re)).toBeLessThan(1e-6 * 159154.9);
	expect(Math.abs(z21im + 1 / (2 * Math.PI * 1e3 * 1e-9)) / 159154.9).toBeLessThan(1e-6);
});
