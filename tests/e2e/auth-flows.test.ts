// The whole identity path in a real browser against the built server, with the reset mail read
// from the local catcher's inbox.
import { expect, test, type Page } from '@playwright/test';
import { artifact } from './artifacts';
import { finishSignUp } from './editor-helpers';

const inbox = process.env.MAIL_INBOX_URL;

async function resetLinkFor(address: string): Promise<string> {
	if (!inbox) throw new Error('MAIL_INBOX_URL is not set: run through `npm test`');
	for (let i = 0; i < 50; i++) {
		const messages = (await (await fetch(`${inbox}/api/messages?to=${encodeURIComponent(address)}`)).json()) as { text: string }[];
		const link = messages[0] && /https?:\/\/\S+\/reset-password\/[a-z2-7]+/.exec(messages[0].text)?.[0];
		if (link) return link;
		await new Promise((r) => setTimeout(r, 100));
	}
	throw new Error(`no reset mail for ${address}`);
}

async function signIn(page: Page, email: string, password: string) {
	await page.goto('/sign-in');
	await page.getByLabel('E-mail address').fill(email);
	await page.getByLabel('Password').fill(password);
	await page.getByRole('button', { name: 'Sign in' }).click();
	// Wait for the answer: a redirect away from /sign-in, or the refusal beside the form.
	await expect(page.getByRole('alert').or(page.getByRole('button', { name: 'Sign out' }))).toBeVisible();
}

test('sign up, sign out, sign in, a wrong password, then forget it and reset it by e-mail', async ({ page }) => {
	const email = `e2e-${Date.now()}@example.test`;
	const header = page.getByRole('navigation', { name: 'Main' });

	await page.goto('/sign-up');
	await page.getByLabel('Your name').fill('Ines Varga');
	await page.getByLabel('E-mail address').fill(email);
	await page.getByLabel('Password').fill('short');
	await page.getByRole('button', { name: 'Create account' }).click();
	await expect(page.getByText('Use at least 10 characters.')).toBeVisible();
	await expect(page.getByLabel('Your name')).toHaveValue('Ines Varga');
	await page.getByLabel('Password').fill('first password 123');
	await page.getByRole('button', { name: 'Create account' }).click();
	await finishSignUp(page, email);
	await expect(page).toHaveURL(/\/workspaces$/);
	await expect(header.getByText('Ines Varga')).toBeVisible();

	await header.getByRole('button', { name: 'Sign out' }).click();
	await expect(header.getByRole('link', { name: 'Sign in' })).toBeVisible();
	await page.goto('/account');
	await expect(page).toHaveURL(/\/sign-in\?next=%2Faccount$/);

	await page.getByLabel('E-mail address').fill(email);
	await page.getByLabel('Password').fill('not my password');
	await page.getByRole('button', { name: 'Sign in' }).click();
	await expect(page.getByRole('alert')).toHaveText('That e-mail address and password do not match an account.');
	await expect(page.getByLabel('E-mail address')).toHaveValue(email);
	await expect(page.getByLabel('Password')).toHaveValue('');

	await page.getByLabel('Password').fill('first password 123');
	await page.getByRole('button', { name: 'Sign in' }).click();
	await expect(page).toHaveURL(/\/account$/);
	await expect(page.getByRole('heading', { name: 'Your account' })).toBeVisible();
	await header.getByRole('button', { name: 'Sign out' }).click();

	await page.goto('/sign-in');
	await page.getByRole('link', { name: 'Forgot your password?' }).click();
	await page.getByLabel('E-mail address').fill(email);
	await page.getByRole('button', { name: 'Send the link' }).click();
	await expect(page.getByRole('status')).toContainText('If an account uses that address');

	const link = await resetLinkFor(email);
	await page.goto(link);
	await page.getByLabel('New password', { exact: true }).fill('second password 456');
	await page.getByLabel('New password, again').fill('second password 456');
	await page.getByRole('button', { name: 'Save the new password' }).click();
	await expect(page).toHaveURL(/\/sign-in\?reset=done$/);
	await expect(page.getByRole('status')).toContainText('Your password is changed');

	await page.goto(link);
	await expect(page.getByRole('heading', { name: 'This link was already used' })).toBeVisible();

	await signIn(page, email, 'first password 123');
	await expect(page.getByRole('alert')).toBeVisible();
	await signIn(page, email, 'second password 456');
	await expect(header.getByText('Ines Varga')).toBeVisible();
});

test('what is typed before the page has finished loading is kept and sent', async ({ page }) => {
	// On a slow device (or a loaded test machine) people type before the page's script has
	// taken over the form; taking over must not reset the fields. The script is held back until
	// the form is filled, then let through.
	let release!: () => void;
	const held = new Promise<void>((ok) => (release = ok));
	await page.route(/\/_app\/immutable\//, async (route) => {
		await held;
		await route.continue();
	});
	const email = `early-${Date.now()}@example.test`;
	// Not 'domcontentloaded': that event waits for the page's module scripts, which are held.
	await page.goto('/sign-up', { waitUntil: 'commit' });
	await expect(page.getByLabel('Your name')).toBeVisible();
	await page.getByLabel('Your name').fill('Teodor Early');
	await page.getByLabel('E-mail address').fill(email);
	await page.getByLabel('Password').fill('typed before load 42');
	release();
	await page.waitForLoadState('networkidle');
	await expect(page.getByLabel('Your name')).toHaveValue('Teodor Early');
	await expect(page.getByLabel('E-mail address')).toHaveValue(email);
	await expect(page.getByLabel('Password')).toHaveValue('typed before load 42');
	await page.getByRole('button', { name: 'Create account' }).click();
	await finishSignUp(page, email);
	await expect(page.getByRole('navigation', { name: 'Main' }).getByText('Teodor Early')).toBeVisible();
});

test('an API token works on an API route once created and stops when revoked', async ({ page, request }) => {
	await signIn(page, 'reviewer@polewise.test', 'polewise-review');
	await page.goto('/account');
	await page.getByLabel('New token name').fill(`e2e script ${Date.now()}`);
	await page.getByRole('button', { name: 'Create token' }).click();
	const token = (await page.getByTestId('new-token').textContent())!.trim();
	expect(token).toMatch(/^pw_[a-z2-7]{32}$/);
	await expect(page.getByLabel('New token name')).toHaveValue('');
	await page.screenshot({ path: artifact('polewise-account.png'), fullPage: true });

	// Playwright's request context has no cookies of the page: only the token authenticates.
	const probe = () => request.get('/api/workspaces', { headers: { authorization: `Bearer ${token}` } });
	expect((await request.get('/api/workspaces')).status()).toBe(401);
	const ok = await probe();
	expect(ok.status()).toBe(200);
	expect(JSON.stringify(await ok.json())).toContain('Kestrel Ridge Instruments');

	await page.reload();
	await expect(page.getByTestId('new-token')).toHaveCount(0); // shown once only
	const revoke = page.getByRole('button', { name: /^Revoke token e2e script/ });
	await revoke.first().click();
	await expect(page.getByText(/revoked: it no longer works/)).toBeVisible();
	expect((await probe()).status()).toBe(401);
});

test('the sign-in page in light and dark', async ({ page }) => {
	await page.setViewportSize({ width: 1100, height: 760 });
	await page.goto('/sign-in?next=/account');
	await page.getByRole('button', { name: 'Sign in' }).click();
	await expect(page.getByText('Enter your e-mail address.')).toBeVisible();
	await page.screenshot({ path: artifact('polewise-sign-in-light.png') });
	await page.getByRole('button', { name: 'Switch to dark theme' }).click();
	await page.screenshot({ path: artifact('polewise-sign-in-dark.png') });
	await page.setViewportSize({ width: 390, height: 800 });
	await page.screenshot({ path: artifact('polewise-sign-in-phone.png') });
});
