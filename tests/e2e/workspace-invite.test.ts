// The team path in a real browser: sign up, make a workspace and a sheet, let members comment
// only, invite a second person by e-mail (the link read from the local mail catcher), and see
// them join through sign-up as a commenter who cannot change the sheet.
import { expect, test, type Page } from '@playwright/test';
import { finishSignUp } from './editor-helpers';

const inbox = process.env.MAIL_INBOX_URL;

async function invitationLinkFor(address: string): Promise<string> {
	if (!inbox) throw new Error('MAIL_INBOX_URL is not set: run through `npm test`');
	for (let i = 0; i < 50; i++) {
		const messages = (await (await fetch(`${inbox}/api/messages?to=${encodeURIComponent(address)}`)).json()) as { text: string }[];
		const link = messages[0] && /https?:\/\/\S+\/invitations\/[a-z2-7]{52}/.exec(messages[0].text)?.[0];
		if (link) return link;
		await new Promise((r) => setTimeout(r, 100));
	}
	throw new Error(`no invitation mail for ${address}`);
}

async function signUp(page: Page, name: string, email: string) {
	await page.getByLabel('Your name').fill(name);
	await page.getByLabel('E-mail address').fill(email);
	await page.getByLabel('Password').fill('bench password 2024');
	await page.getByRole('button', { name: 'Create account' }).click();
	await finishSignUp(page, email);
}

test('invite a teammate by e-mail; they sign up through the link and join as a commenter who cannot edit', async ({ page, browser }) => {
	const stamp = `${Date.now()}-${Math.random().toString(36).slice(2, 6)}`;
	const ownerEmail = `owner-${stamp}@example.test`;
	const reviewerEmail = `reviewer-${stamp}@example.test`;

	await page.goto('/sign-up');
	await signUp(page, 'Wren Okafor', ownerEmail);
	await expect(page).toHaveURL(/\/workspaces$/);
	await expect(page.getByText('No workspaces yet')).toBeVisible();

	// A blank name is refused beside the field (the field's maxlength keeps names short).
	await page.getByLabel('Name').fill('   ');
	await page.getByRole('button', { name: 'Create workspace' }).click();
	await expect(page.getByText('Workspace name is required')).toBeVisible();
	await page.getByLabel('Name').fill(`Probe bench ${stamp}`);
	await page.getByRole('button', { name: 'Create workspace' }).click();
	await expect(page.getByRole('heading', { level: 1, name: `Probe bench ${stamp}` })).toBeVisible();
	await expect(page.getByText('No sheets yet — create one.')).toBeVisible();

	await page.getByLabel('Sheet name').fill('Scope probe <b>10:1</b>');
	await page.getByRole('button', { name: 'Create sheet' }).click();
	await expect(page).toHaveURL(/\/sheets\/[0-9a-f-]{36}$/);
	// Markup in a name is shown as the characters typed, never as markup.
	await expect(page.getByRole('heading', { level: 1 })).toHaveText('Scope probe <b>10:1</b>');

	await page.goto('/workspaces');
	await page.getByRole('link', { name: new RegExp(`Probe bench ${stamp}`) }).click();
	await page.getByRole('navigation', { name: 'Workspace' }).getByRole('link', { name: 'Members & settings' }).click();
	await page.getByLabel('Default sheet role for members').selectOption('commenter');
	await page.getByRole('button', { name: 'Save settings' }).click();
	await expect(page.getByText('Settings saved.')).toBeVisible();

	await page.getByLabel('E-mail address').fill('not an address');
	await page.getByRole('button', { name: 'Send invitation' }).click();
	await expect(page.getByText('Enter a valid e-mail address, like name@example.com').first()).toBeVisible();
	await page.getByLabel('E-mail address').fill(reviewerEmail);
	await page.getByRole('button', { name: 'Send invitation' }).click();
	await expect(page.getByText(`Invitation sent to ${reviewerEmail}`)).toBeVisible();
	await expect(page.getByRole('region', { name: 'Pending invitations' }).getByText(reviewerEmail)).toBeVisible();

	// The reviewer, in a browser of their own, follows the mailed link and signs up on the way.
	const link = await invitationLinkFor(reviewerEmail);
	const reviewer = await (await browser.newContext()).newPage();
	await reviewer.goto(link);
	await expect(reviewer.getByRole('heading', { name: `Join the workspace “Probe bench ${stamp}”` })).toBeVisible();
	await reviewer.getByRole('link', { name: 'Create an account' }).click();
	await signUp(reviewer, 'Jun Takeda', reviewerEmail);
	await expect(reviewer).toHaveURL(/\/invitations\/[a-z2-7]{52}$/);
	await reviewer.getByRole('button', { name: 'Accept and open' }).click();
	await expect(reviewer.getByRole('heading', { level: 1, name: `Probe bench ${stamp}` })).toBeVisible();

	// Commenter: the sheet opens read-only, with no rename, trash or sharing controls.
	const row = reviewer.getByRole('row', { name: /Scope probe/ });
	await expect(row.getByRole('button', { name: /Trash/ })).toHaveCount(0);
	await expect(row.getByText('Rename')).toHaveCount(0);
	await row.getByRole('link', { name: 'Scope probe <b>10:1</b>' }).click();
	await expect(reviewer.getByText('commenter', { exact: true })).toBeVisible();
	await expect(reviewer.getByText('Read-only for you — you can comment.')).toBeVisible();
	await expect(reviewer.getByRole('button', { name: 'Rename' })).toHaveCount(0);
	await expect(reviewer.getByRole('heading', { name: 'Sharing' })).toHaveCount(0);
	const sheetId = reviewer.url().split('/sheets/')[1];
	const save = await reviewer.request.put(`/api/sheets/${sheetId}/revisions`, {
		data: { baseRevision: 1, document: { schema: 1, elements: [], input: 'Vin', output: { node: 'out' } } }
	});
	expect(save.status()).toBe(403);

	// The owner sees the new member in the members table and the invitation gone from pending.
	await page.reload();
	await expect(page.getByRole('row', { name: /Jun Takeda/ })).toBeVisible();
	await expect(page.getByText('No invitations waiting for an answer.')).toBeVisible();
	await reviewer.context().close();
});
