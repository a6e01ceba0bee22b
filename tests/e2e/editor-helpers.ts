// Shared steps of the editor's browser tests: a fresh account per test, sheets made through the
// JSON API, and gestures on the canvas (drag from the parts list, wire two terminals).
import { expect, type Page } from '@playwright/test';

export async function signUpFresh(
	page: Page,
	name = 'Oda Lindqvist'
): Promise<{ email: string; password: string }> {
	const email = `editor-${Date.now()}-${Math.random().toString(36).slice(2, 7)}@example.test`;
	const password = 'divider test password 42';
	await page.goto('/sign-up');
	await page.getByLabel('Your name').fill(name);
	await page.getByLabel('E-mail address').fill(email);
	await page.getByLabel('Password').fill(password);
	await page.getByRole('button', { name: 'Create account' }).click();
	await finishSignUp(page, email);
	await expect(page).toHaveURL(/\/workspaces/);
	return { email, password };
}

/**
 * After the sign-up form: the page says to check the inbox; the link from the local mail
 * catcher finishes the account (signed in, then on to where sign-up started).
 */
export async function finishSignUp(page: Page, email: string): Promise<void> {
	await expect(page.getByRole('status')).toContainText('Check your inbox');
	const inbox = process.env.MAIL_INBOX_URL;
	if (!inbox) throw new Error('MAIL_INBOX_URL is not set: run through `npm test`');
	let link: string | undefined;
	for (let i = 0; i < 100 && !link; i++) {
		const messages = (await (
			await fetch(`${inbox}/api/messages?to=${encodeURIComponent(email)}`)
		).json()) as { text: string }[];
		link = messages
			.map((m) => /https?:\/\/\S+\/sign-up\/[a-z2-7]{52}/.exec(m.text)?.[0])
			.find(Boolean);
		if (!link) await new Promise((r) => setTimeout(r, 100));
	}
	if (!link) throw new Error(`no sign-up mail for ${email}`);
	await page.goto(link);
	await page.getByRole('button', { name: 'Create my account' }).click();
	await expect(page).not.toHaveURL(/\/sign-up\//);
}

export async function signIn(page: Page, email: string, password: string) {
	await page.goto('/sign-in');
	await page.getByLabel('E-mail address').fill(email);
	await page.getByLabel('Password').fill(password);
	await page.getByRole('button', { name: 'Sign in' }).click();
	await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
}

/** A workspace and a sheet holding `document`, made through the API as the signed-in user. */
export async function newSheet(
	page: Page,
	document: unknown,
	name = 'Editor test sheet'
): Promise<string> {
	const ws = await page.request.post('/api/workspaces', { data: { name: `Bench ${Date.now()}` } });
	expect(ws.status()).toBe(201);
	const { workspace } = await ws.json();
	const sh = await page.request.post(`/api/workspaces/${workspace.id}/sheets`, {
		data: { name, document }
	});
	expect(sh.status()).toBe(201);
	return (await sh.json()).sheet.id;
}

export async function openSheet(page: Page, id: string) {
	await page.goto(`/sheets/${id}`);
	await expect(
		page.getByRole('application', { name: 'Schematic canvas', exact: true })
	).toBeVisible();
	await expect(page.locator('.svelte-flow__viewport')).toBeVisible();
}

export const node = (page: Page, name: string) =>
	page.locator('.svelte-flow__node', { has: page.locator(`[data-name="${name}"]`) });
export const nodeOfKind = (page: Page, kind: string) =>
	page.locator('.svelte-flow__node', { has: page.locator(`[data-kind="${kind}"]`) });
export const terminal = (page: Page, nodeLocator: ReturnType<typeof node>, t: string) =>
	nodeLocator.locator(`.svelte-flow__handle[data-handleid="${t}"]`);

/** Drag a part from the parts list onto the canvas at (x, y) relative to the canvas' top-left. */
export async function dropPart(page: Page, title: string, x: number, y: number) {
	const canvas = page.getByRole('application', { name: 'Schematic canvas', exact: true });
	// A drag whose target is below the fold scrolls the page halfway through the drag and the
	// drop is lost: bring the whole canvas into view first (the review panel sits above it).
	await canvas.evaluate((el) => {
		const r = el.getBoundingClientRect();
		if (r.top < 0 || r.bottom > window.innerHeight) el.scrollIntoView({ block: 'center' });
	});
	await page
		.getByRole('button', { name: `Place ${title}` })
		.dragTo(canvas, { targetPosition: { x, y } });
}

/** Draw a wire: press on one terminal, move, release on the other. */
export async function wire(
	page: Page,
	from: ReturnType<typeof terminal>,
	to: ReturnType<typeof terminal>
) {
	const a = (await from.boundingBox())!;
	const b = (await to.boundingBox())!;
	await page.mouse.move(a.x + a.width / 2, a.y + a.height / 2);
	await page.mouse.down();
	await page.mouse.move((a.x + b.x) / 2 + 3, (a.y + b.y) / 2 + 3, { steps: 4 });
	await page.mouse.move(b.x + b.width / 2, b.y + b.height / 2, { steps: 4 });
	await page.mouse.up();
}

/** Select a part by clicking its symbol and type its value into the properties panel. */
export async function setValue(page: Page, name: string, value: string) {
	await node(page, name).click();
	const field = page.getByRole('region', { name: 'Properties' }).getByRole('textbox').nth(1);
	await field.fill(value);
}

export const analysis = (page: Page) => page.getByRole('region', { name: 'Analysis', exact: true });

/** Hz of each exact pole in the pole table, smallest first. */
export async function poleHz(page: Page): Promise<number[]> {
	const cells = page.getByRole('table', { name: 'Poles' }).getByTestId('pole-hz');
	return (await cells.evaluateAll((els) =>
		els.map((e) => Number(e.getAttribute('data-hz')))
	)) as number[];
}

/** A one-pole RC low-pass (1 kΩ, 10 nF) between "in" and "out": the editor tests' small sheet. */
export const RC_LOW_PASS = {
	schema: 1,
	elements: [
		{ id: 'Vin', type: 'V', nodes: ['in', 'gnd'], value: 1 },
		{ id: 'R1', type: 'R', nodes: ['in', 'out'], value: '1k' },
		{ id: 'C1', type: 'C', nodes: ['out', 'gnd'], value: '10n' }
	],
	input: 'Vin',
	output: { node: 'out', reference: 'gnd' }
};

/** A sheet with nothing on it. */
export const EMPTY_SHEET = {
	schema: 1,
	elements: [],
	input: 'none',
	output: { node: 'gnd', reference: 'gnd' }
};

/**
 * Closed form of the divider's two-node network (nodal analysis, sources at zero): with
 * Yt = 1/Rt + sCt, Yi = 1/Ri + sCi, Gs = 1/Rs the determinant is Gs(Yt + Yi) + Yt·Yi, i.e.
 *   Ct·Ci s² + (Gs(Ct + Ci) + Ci/Rt + Ct/Ri) s + Gs(1/Rt + 1/Ri) + 1/(Rt·Ri) = 0.
 * Roots by the quadratic formula in its cancellation-free form (s1 = (−b − √D)/2a, s2 = c/(a·s1)).
 */
export function dividerPolesHz(
	Rs: number,
	Rt: number,
	Ct: number,
	Ri: number,
	Ci: number
): number[] {
	const Gs = 1 / Rs;
	const a = Ct * Ci;
	const b = Gs * (Ct + Ci) + Ci / Rt + Ct / Ri;
	const c = Gs * (1 / Rt + 1 / Ri) + 1 / (Rt * Ri);
	const s1 = (-b - Math.sqrt(b * b - 4 * a * c)) / (2 * a);
	const s2 = c / (a * s1);
	return [s2, s1].map((s) => Math.abs(s) / (2 * Math.PI)).sort((x, y) => x - y);
}

/** A picture of the drawing alone (toolbar, parts, canvas, properties; not the results below). */
export async function drawingShot(page: Page, path: string) {
	await page.evaluate(() => document.querySelector('#drawing')?.scrollIntoView({ block: 'start' }));
	const d = (await page.locator('#drawing').boundingBox())!;
	const c = (await page
		.getByRole('application', { name: 'Schematic canvas', exact: true })
		.boundingBox())!;
	await page.screenshot({
		path,
		clip: { x: d.x, y: d.y, width: d.width, height: c.y + c.height - d.y + 2 }
	});
}
