// Two browser contexts edit the same sheet: the second save loses the race, the banner says what
// the other person changed, and saving on top keeps both revisions.
import { expect, test } from '@playwright/test';
import {
	newSheet,
	node,
	openSheet,
	setValue,
	signIn,
	signUpFresh,
	RC_LOW_PASS
} from './editor-helpers';

const RC = RC_LOW_PASS;

test('a stale save shows the conflict banner; saving mine on top loses nothing', async ({
	browser
}) => {
	test.setTimeout(60_000);
	const ctxA = await browser.newContext();
	const ctxB = await browser.newContext();
	const a = await ctxA.newPage();
	const b = await ctxB.newPage();
	const account = await signUpFresh(a, 'Runa Okafor');
	await signIn(b, account.email, account.password);
	const id = await newSheet(a, RC, 'Shared divider');
	await openSheet(a, id);
	await openSheet(b, id);

	await setValue(a, 'R1', '2k');
	await expect(a.locator('[data-save-status]')).toHaveAttribute('data-revision', '2');

	await setValue(b, 'C1', '22n');
	const banner = b.getByRole('alert').filter({ hasText: 'Someone else saved this sheet' });
	await expect(banner).toBeVisible();
	await expect(banner.getByTestId('conflict-changes')).toContainText('R1: value 1k → 2k');
	await expect(b.locator('[data-save-status]')).toHaveAttribute('data-save-status', 'conflict');

	await banner.getByRole('button', { name: 'Save mine on top as a new revision' }).click();
	await expect(b.locator('[data-save-status]')).toHaveAttribute('data-revision', '3');
	await expect(banner).toBeHidden();

	// Both edits survive in the history: revision 2 is A's, revision 3 is B's.
	const r2 = await (await b.request.get(`/api/sheets/${id}/revisions/2`)).json();
	const r3 = await (await b.request.get(`/api/sheets/${id}/revisions/3`)).json();
	const value = (r: { revision: { document: typeof RC } }, el: string) =>
		r.revision.document.elements.find((e) => e.id === el)!.value;
	expect(value(r2, 'R1')).toBe('2k');
	expect(value(r3, 'C1')).toBe('22n');
	await expect(node(b, 'C1')).toContainText('22 nF');
	await ctxA.close();
	await ctxB.close();
});

test('loading their version keeps mine aside and can bring it back', async ({ browser }) => {
	test.setTimeout(60_000); // two browsers and two accounts' pages on a shared 2-core machine
	const ctxA = await browser.newContext();
	const ctxB = await browser.newContext();
	const a = await ctxA.newPage();
	const b = await ctxB.newPage();
	const account = await signUpFresh(a, 'Tavi Moreau');
	await signIn(b, account.email, account.password);
	const id = await newSheet(a, RC, 'Shared low-pass');
	await openSheet(a, id);
	await openSheet(b, id);
	await setValue(a, 'R1', '3.3k');
	await expect(a.locator('[data-save-status]')).toHaveAttribute('data-revision', '2');
	await setValue(b, 'R1', '4.7k');
	await b.getByRole('button', { name: 'Load their version (yours is kept aside)' }).click();
	await expect(node(b, 'R1')).toContainText('3.3 kΩ');
	await b.getByRole('button', { name: 'Bring mine back' }).click();
	await expect(node(b, 'R1')).toContainText('4.7 kΩ');
	await expect(b.locator('[data-save-status]')).toHaveAttribute('data-revision', '3');
	await ctxA.close();
	await ctxB.close();
});
