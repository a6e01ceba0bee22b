// Acceptance (issue 18): the 10:1 divider drawn, wired, valued and commented on with the keyboard
// alone — no click, no pointer, no programmatic focus: only key presses, with locators used to
// read the page. Parts come from the parts list (Tab, Enter); wires are drawn terminal to
// terminal (T, Enter … T, Enter) and by net name (N); values are typed after Enter on a part;
// the comment is posted from the part with C. The poles are checked against the closed form.
import { expect, test, type Page } from '@playwright/test';
import {
	analysis,
	dividerPolesHz,
	EMPTY_SHEET,
	newSheet,
	openSheet,
	poleHz,
	signUpFresh
} from './editor-helpers';

const focusedName = (page: Page) =>
	page.evaluate(() => {
		const el = document.activeElement as HTMLElement | null;
		return el?.getAttribute('aria-label') ?? el?.textContent?.trim() ?? '';
	});

/** Press Tab (or Shift+Tab) until the focused element's name matches, as a keyboard user would. */
async function tabTo(page: Page, name: RegExp, back = false) {
	for (let i = 0; i < 120; i++) {
		if (name.test(await focusedName(page))) return;
		await page.keyboard.press(back ? 'Shift+Tab' : 'Tab');
	}
	throw new Error(`no tab stop named ${name}`);
}

/** On the canvas: Home, then Page Down through the parts until the one named `name`. */
async function goToPart(page: Page, name: RegExp) {
	await page.keyboard.press('Home');
	for (let i = 0; i < 30; i++) {
		if (name.test(await focusedName(page))) return;
		await page.keyboard.press('PageDown');
	}
	throw new Error(`no part named ${name} on the canvas`);
}

const said = (page: Page) => page.getByTestId('canvas-announcer');

/** From a part with the focus: its n-th terminal (T, then arrow keys). */
async function terminalOf(page: Page, n: number) {
	await page.keyboard.press('t');
	for (let i = 1; i < n; i++) await page.keyboard.press('ArrowRight');
}

/** Join the focused part's n-th terminal to a net by typing its name. */
async function joinByName(page: Page, part: RegExp, n: number, net: string) {
	await goToPart(page, part);
	await terminalOf(page, n);
	await page.keyboard.press('n');
	await expect(page.getByRole('form', { name: 'Join a net' })).toBeVisible();
	await page.keyboard.type(net);
	await page.keyboard.press('Enter');
	await expect(said(page)).toContainText(`on ${net}`);
	await page.keyboard.press('Escape'); // back to the part
}

/** Draw a wire between two terminals: T and Enter on each end. */
async function wireByKeys(page: Page, a: [RegExp, number], b: [RegExp, number]) {
	await goToPart(page, a[0]);
	await terminalOf(page, a[1]);
	await page.keyboard.press('Enter');
	await expect(said(page)).toContainText('Wire from');
	await page.keyboard.press('Escape');
	await goToPart(page, b[0]);
	await terminalOf(page, b[1]);
	await page.keyboard.press('Enter');
	await expect(said(page)).toContainText('Wired');
	await page.keyboard.press('Escape');
}

async function typeValue(page: Page, part: RegExp, value: string) {
	await goToPart(page, part);
	await page.keyboard.press('Enter'); // to the value field, its text selected
	await page.keyboard.type(value);
	await page.keyboard.press('Escape'); // back to the part on the canvas
	await expect.poll(() => focusedName(page)).toMatch(part);
}

test('draw, wire, value and comment on the 10:1 divider by keyboard alone', async ({ page }) => {
	test.setTimeout(180_000);
	await page.setViewportSize({ width: 1440, height: 1000 });
	await signUpFresh(page);
	await openSheet(page, await newSheet(page, EMPTY_SHEET, 'Divider by keyboard'));
	await expect(analysis(page)).toContainText('the sheet is empty');

	// Place the parts: Tab to the parts list, Enter. The focus moves to the new part each time;
	// Shift+Tab goes back from the canvas to the list.
	let first = true;
	for (const [title, name] of [
		['Voltage source', /^V1,/],
		['Resistor', /^R1,/],
		['Resistor', /^R2,/],
		['Capacitor', /^C1,/],
		['Resistor', /^R3,/],
		['Capacitor', /^C2,/],
		['Output marker', /^Output marker/]
	] as const) {
		await tabTo(page, new RegExp(`^Place ${title}$`), !first);
		first = false;
		await page.keyboard.press('Enter');
		await expect.poll(() => focusedName(page)).toMatch(name);
		await expect(said(page)).toContainText('Placed');
	}

	// The source to the series resistor by a wire, terminal to terminal.
	await wireByKeys(page, [/^V1,/, 1], [/^R1,/, 1]);
	await expect(page.locator('.svelte-flow__edge')).toHaveCount(1);
	// The rest by net names: tip (the probe tip), adc (the digitizer input), gnd.
	await joinByName(page, /^R1,/, 2, 'tip');
	await joinByName(page, /^R2,/, 1, 'tip');
	await joinByName(page, /^C1,/, 1, 'tip');
	await joinByName(page, /^R2,/, 2, 'adc');
	await joinByName(page, /^C1,/, 2, 'adc');
	await joinByName(page, /^R3,/, 1, 'adc');
	await joinByName(page, /^C2,/, 1, 'adc');
	await joinByName(page, /^Output marker/, 1, 'adc');
	await joinByName(page, /^V1,/, 2, 'gnd');
	await joinByName(page, /^R3,/, 2, 'gnd');
	await joinByName(page, /^C2,/, 2, 'gnd');

	await typeValue(page, /^R1,/, '50');
	await typeValue(page, /^R2,/, '9M');
	await typeValue(page, /^C1,/, '10p');
	await typeValue(page, /^R3,/, '1M');
	await typeValue(page, /^C2,/, '90p');

	// The parts say where they sit, in words.
	await goToPart(page, /^R2,/);
	expect(await focusedName(page)).toBe('R2, resistor 9 MΩ, between tip and adc');
	await goToPart(page, /^C2,/);
	expect(await focusedName(page)).toBe('C2, capacitor 90 pF, between adc and gnd');

	await expect(analysis(page)).toHaveAttribute('data-analysis-status', 'done');
	await expect(page.getByRole('table', { name: 'Poles' }).getByTestId('pole-hz')).toHaveCount(2);
	const shown = await poleHz(page);
	const expected = dividerPolesHz(50, 9e6, 10e-12, 1e6, 90e-12);
	for (const [i, f] of expected.entries()) expect(Math.abs(shown[i] - f) / f).toBeLessThan(1e-6);

	// A comment on C2, from the part itself: C opens the review's box with C2 chosen.
	await goToPart(page, /^C2,/);
	await page.keyboard.press('c');
	await expect.poll(() => page.evaluate(() => document.activeElement?.id)).toBe('new-comment');
	await page.keyboard.type('The 90 pF sets the slow pole; check it against the cable.');
	await tabTo(page, /^Post comment$/);
	await page.keyboard.press('Enter');
	const thread = page.getByTestId('comment-thread').filter({ hasText: 'The 90 pF sets' });
	await expect(thread).toHaveAttribute('data-anchor', 'element:C2');
	// After posting, the focus is back in the (empty) box and the post was announced.
	await expect.poll(() => page.evaluate(() => document.activeElement?.id)).toBe('new-comment');
	await expect(page.getByTestId('comment-posted')).toContainText('Comment posted on C2');

	// Everything was saved, as a new revision.
	const saved = page.locator('[data-save-status="saved"]');
	await expect(saved).toBeVisible();
	expect(Number(await saved.getAttribute('data-revision'))).toBeGreaterThan(1);
});
