// Live updates survive a cut connection: A's event stream is cut (the browser goes offline and
// the open stream errors) while B comments; when A is back, the stream that reopens resumes
// after the last event id A had and replays B's comment, and A sees it without a reload. The
// status line says the stream is back. Also: the jump link at the top of the sheet page leads
// a reviewer straight to the review panel.
import { expect, test, type Page } from '@playwright/test';
import { newSheet, openSheet, signUpFresh } from './editor-helpers';
import { artifact } from './artifacts';

const RC = {
	schema: 1,
	elements: [
		{ id: 'V1', type: 'V', nodes: ['in', 'gnd'], value: 1 },
		{ id: 'R1', type: 'R', nodes: ['in', 'out'], value: '4.7k' },
		{ id: 'C1', type: 'C', nodes: ['out', 'gnd'], value: '330p' }
	],
	input: 'V1',
	output: { node: 'out' }
};

// Every EventSource the page makes, with the messages it received, so the test can cut the
// live one and see which connection delivered what.
const TRACK = () => {
	const Native = window.EventSource;
	type Entry = {
		url: string;
		source: EventSource;
		ready: string | null;
		messages: { id: string; data: string }[];
	};
	const seen: Entry[] = [];
	(window as unknown as { __streams: typeof seen }).__streams = seen;
	window.EventSource = class extends Native {
		constructor(url: string | URL, init?: EventSourceInit) {
			super(url, init);
			const entry: Entry = {
				url: String(url),
				source: this as EventSource,
				ready: null,
				messages: []
			};
			seen.push(entry);
			this.addEventListener('ready', (e) => (entry.ready = (e as MessageEvent).lastEventId));
			this.addEventListener('message', (e) =>
				entry.messages.push({ id: e.lastEventId, data: e.data })
			);
		}
	} as typeof EventSource;
};

const panel = (page: Page) => page.getByRole('region', { name: 'Review' });
type Stream = { url: string; ready: string | null; messages: { id: string; data: string }[] };
const streams = (page: Page) =>
	page.evaluate(() =>
		(window as unknown as { __streams: Stream[] }).__streams
			.filter((s) => s.url.includes('/api/sheets/'))
			.map((s) => ({ url: s.url, ready: s.ready, messages: s.messages }))
	) as Promise<Stream[]>;

test('a cut live stream reopens after its last event id and replays what was said meanwhile', async ({
	browser
}) => {
	test.setTimeout(90_000);
	const ctxA = await browser.newContext({ viewport: { width: 1400, height: 1000 } });
	const ctxB = await browser.newContext({ viewport: { width: 1400, height: 1000 } });
	await ctxA.addInitScript(TRACK);
	const a = await ctxA.newPage();
	const b = await ctxB.newPage();
	await signUpFresh(a, 'Maren Oyelaran');
	const sheetId = await newSheet(a, RC, 'Reconnect RC');
	const { email: emailB } = await signUpFresh(b, 'Tomasz Ekwueme');
	expect(
		(
			await a.request.post(`/api/sheets/${sheetId}/grants`, {
				data: { email: emailB, role: 'commenter' }
			})
		).status()
	).toBe(201);

	await openSheet(a, sheetId);
	await openSheet(b, sheetId);
	await expect(panel(a).getByTestId('live-status')).toHaveText('● live');
	await expect(panel(b).getByTestId('live-status')).toHaveText(/live/);

	// The jump link at the top of the page takes A to the review panel.
	const jump = a.getByRole('navigation', { name: 'On this sheet' }).getByTestId('jump-review');
	await expect(jump).toContainText('Not yet sent for review');
	await jump.click();
	await expect(a).toHaveURL(/#review-panel$/);
	await expect(panel(a)).toBeInViewport();

	// Cut A: offline, and the open stream fails as a dropped connection does.
	const [first] = await streams(a);
	expect(first.ready, 'the stream names its starting id').toMatch(/^\d+$/);
	await ctxA.setOffline(true);
	await a.evaluate(() => {
		(window as unknown as { __sameDocument: boolean }).__sameDocument = true;
		const all = (window as unknown as { __streams: { url: string; source: EventSource }[] })
			.__streams;
		const live = all.filter((s) => s.url.includes('/api/sheets/')).at(-1)!.source;
		live.close();
		live.dispatchEvent(new Event('error'));
	});
	await expect(panel(a).getByTestId('live-status')).toHaveText(/reconnecting/);

	// B comments while A is away; A cannot have it yet.
	const text = panel(b).getByLabel('Comment', { exact: true });
	await text.fill('R1 at 4.7k: is the source impedance included?');
	await panel(b).getByRole('button', { name: 'Post comment' }).click();
	await expect(panel(b).getByText('is the source impedance included?')).toBeVisible();
	await a.waitForTimeout(1500);
	await expect(panel(a).getByText('is the source impedance included?')).toHaveCount(0);

	// A is back: the stream reopens by itself and the comment appears without a reload.
	await ctxA.setOffline(false);
	await expect(panel(a).getByText('R1 at 4.7k: is the source impedance included?')).toBeVisible({
		timeout: 30_000
	});
	await expect(panel(a).getByTestId('live-status')).toHaveText(/live — back since .*caught up/);
	expect(
		await a.evaluate(() => (window as unknown as { __sameDocument?: boolean }).__sameDocument)
	).toBe(true);

	// The reopened stream asked to resume after the id the cut one had reached (its first
	// frame: no event had come before the cut), and the server replayed B's comment on it.
	const reopened = (await streams(a)).slice(1).find((s) => s.messages.length);
	expect(reopened, 'a stream opened after the cut that received events').toBeTruthy();
	expect(reopened!.url).toMatch(/[?&]after=\d+/);
	const resumedFrom = Number(/after=(\d+)/.exec(reopened!.url)![1]);
	expect(resumedFrom).toBe(Number(first.ready));
	const replayed = reopened!.messages.map((m) => ({
		id: Number(m.id),
		kind: JSON.parse(m.data).kind
	}));
	expect(replayed[0]).toMatchObject({ kind: 'comment' });
	expect(replayed[0].id).toBeGreaterThan(resumedFrom);
	await a.screenshot({ path: artifact('review-reconnected.png'), fullPage: false });
	await ctxA.close();
	await ctxB.close();
});
