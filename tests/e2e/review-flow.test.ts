// Two people in two browsers: A asks B (a commenter) for a review; B comments on a capacitor and
// on a pole row; A sees both appear without reloading (server-sent events); B signs off; A edits
// a value and sees that the sheet changed since approval, with a one-click comparison. Mail goes
// to the fake inbox; the bell counts unread notifications.
import { expect, test, type Page } from '@playwright/test';
import { newSheet, openSheet, setValue, signUpFresh } from './editor-helpers';
import { artifact } from './artifacts';

const RC = {
	schema: 1,
	elements: [
		{ id: 'V1', type: 'V', nodes: ['in', 'gnd'], value: 1 },
		{ id: 'R1', type: 'R', nodes: ['in', 'out'], value: '1k' },
		{ id: 'C1', type: 'C', nodes: ['out', 'gnd'], value: '1n' }
	],
	input: 'V1',
	output: { node: 'out' }
};

const panel = (page: Page) => page.getByRole('region', { name: 'Review' });

async function inbox(page: Page, address: string, subject: RegExp) {
	const base = process.env.MAIL_INBOX_URL;
	expect(base, 'MAIL_INBOX_URL (run through npm test)').toBeTruthy();
	await expect
		.poll(async () => ((await (await page.request.get(`${base}/api/messages?to=${encodeURIComponent(address)}`)).json()) as { subject: string }[]).map((m) => m.subject).join('\n'), { timeout: 10_000 })
		.toMatch(subject);
}

test('request, comment on a part and a pole, live updates, sign-off, changed since approval', async ({ browser }) => {
	test.setTimeout(90_000);
	const ctxA = await browser.newContext({ viewport: { width: 1500, height: 1000 } });
	const ctxB = await browser.newContext({ viewport: { width: 1500, height: 1000 } });
	const a = await ctxA.newPage();
	const b = await ctxB.newPage();

	const { email: emailA } = await signUpFresh(a, 'Aino Pellervo');
	const sheetId = await newSheet(a, RC, 'Review flow RC low-pass');
	const { email: emailB } = await signUpFresh(b, 'Bram Okafor');
	const shared = await a.request.post(`/api/sheets/${sheetId}/grants`, { data: { email: emailB, role: 'commenter' } });
	expect(shared.status()).toBe(201);

	await openSheet(a, sheetId);
	await openSheet(b, sheetId);
	await expect(panel(a).getByTestId('live-status')).toHaveText(/live/);
	await expect(panel(b).getByTestId('live-status')).toHaveText(/live/);
	await expect(panel(a).getByTestId('review-state')).toHaveText(/Not yet sent for review/);

	// A asks B for a review of revision 1.
	await panel(a).getByRole('button', { name: 'Ask for review' }).click();
	const dialog = a.getByRole('dialog', { name: /Ask for a review/ });
	await dialog.getByRole('checkbox', { name: /Bram Okafor/ }).check();
	await dialog.getByLabel('Message').fill('Please look at the corner frequency.');
	await dialog.getByLabel('Due by (optional)').fill('2026-12-24');
	await dialog.getByRole('button', { name: 'Send request' }).click();
	await expect(panel(a).getByTestId('review-state')).toHaveText(/With reviewers/);
	await inbox(a, emailB, /asks you to review “Review flow RC low-pass”/);

	// B sees the request arrive live, and the bell counts it.
	await expect(panel(b).getByRole('region', { name: 'Your review' })).toBeVisible();
	await expect(b.getByTestId('unread-count')).toHaveText('1');

	// B comments on the capacitor from its marker on the canvas, mentioning A.
	await b.getByRole('button', { name: 'Comment on C1' }).click();
	await expect(panel(b).getByLabel('About')).toHaveValue('element:C1');
	const text = panel(b).getByLabel('Comment', { exact: true });
	await text.fill('Is C1 a C0G part? @aino');
	await expect(b.getByRole('option', { name: /Aino Pellervo/ })).toBeVisible();
	await text.press('Enter');
	await text.pressSequentially('please check.');
	await panel(b).getByRole('button', { name: 'Post comment' }).click();
	// …and on the pole row of the results.
	await b.getByRole('table', { name: 'Poles' }).getByRole('button', { name: 'Comment on pole p1' }).click();
	await expect(panel(b).getByLabel('About')).toHaveValue('pole:p1');
	await text.fill('p1 sits at 159 kHz: enough margin for the 100 kHz band?');
	await panel(b).getByRole('button', { name: 'Post comment' }).click();

	// A sees both threads without reloading, and the markers on the canvas and pole row.
	await expect(panel(a).locator('[data-anchor="element:C1"]')).toContainText('Is C1 a C0G part?');
	await expect(panel(a).locator('[data-anchor="element:C1"] .pw-mention')).toHaveText('@Aino Pellervo');
	await expect(panel(a).locator('[data-anchor="pole:p1"]')).toContainText('p1 sits at 159 kHz');
	await expect(a.getByRole('button', { name: '1 open comment on C1' })).toBeVisible();
	await expect(a.getByRole('table', { name: 'Poles' }).getByRole('button', { name: '1 open comment on pole p1' })).toBeVisible();
	await inbox(a, emailA, /Bram Okafor mentioned you on “Review flow RC low-pass”/);
	await a.screenshot({ path: artifact('review-a-threads.png'), fullPage: true });

	// B signs off revision 1; A sees it live.
	const mine = panel(b).getByRole('region', { name: 'Your review' });
	await mine.getByLabel('Summary').fill('Corner at 159 kHz is fine for this band.');
	await mine.getByRole('button', { name: 'Sign off revision 1…' }).click();
	await mine.getByRole('button', { name: 'Yes, sign off revision 1' }).click();
	await expect(panel(a).getByTestId('review-state')).toHaveText(/Signed off\s+—\s+revision 1/);
	await b.screenshot({ path: artifact('review-b-signed.png'), fullPage: true });

	// A edits R1; the sheet now differs from what was signed off.
	await setValue(a, 'R1', '2k');
	await expect(a.locator('[data-save-status]')).toHaveAttribute('data-save-status', 'saved', { timeout: 15_000 });
	const notice = panel(a).getByTestId('changed-since-approval');
	await expect(notice).toContainText('changed since sign-off');
	// R1 changed, C1 did not: only the pole comment now refers to an earlier revision.
	await expect(panel(a).locator('[data-anchor="pole:p1"] [data-testid="earlier-revision"]')).toBeVisible();
	await expect(panel(a).locator('[data-anchor="element:C1"] [data-testid="earlier-revision"]')).toHaveCount(0);
	// B is told a newer revision exists, without reloading.
	await expect(panel(b).getByText('Someone saved revision 2.')).toBeVisible();
	await a.screenshot({ path: artifact('review-a-changed.png'), fullPage: true });
	await notice.getByRole('link', { name: 'Compare 1 with 2' }).click();
	await expect(a.getByTestId('element-changes')).toContainText('R1');
	await expect(a.getByTestId('element-changes')).toContainText('2 kΩ');
	// Closed form: R doubles, so the single pole −1/RC halves (−50 %).
	await expect(a.getByTestId('p-movement').getByTestId('movement')).toHaveText('−50.0 %');
	await a.screenshot({ path: artifact('review-compare.png'), fullPage: true });
	await ctxA.close();
	await ctxB.close();
});

