// A reviewer sees, beside the sign-off buttons, the sheet's spec limits on the revision they
// are asked about, against the one before it, and the jump link at the top of the sheet says
// their answer is asked. RC low-pass, closed form −3 dB at 1/(2πRC): 1 kΩ·1 nF gives 159.2 kHz,
// 2 kΩ gives 79.58 kHz, so "bandwidth ≥ 100 kHz" is met on revision 1 and missed on revision 2.
import { expect, test } from '@playwright/test';
import { newSheet, openSheet, signUpFresh } from './editor-helpers';
import { artifact } from './artifacts';

const rc = (r: string) => ({
	schema: 1,
	elements: [
		{ id: 'V1', type: 'V', nodes: ['in', 'gnd'], value: 1 },
		{ id: 'R1', type: 'R', nodes: ['in', 'out'], value: r },
		{ id: 'C1', type: 'C', nodes: ['out', 'gnd'], value: '1n' }
	],
	input: 'V1',
	output: { node: 'out' }
});

test('the review answer shows each spec line before and after, and the top of the page says an answer is asked', async ({
	browser
}) => {
	const ctxA = await browser.newContext({ viewport: { width: 1400, height: 1000 } });
	const ctxB = await browser.newContext({ viewport: { width: 1400, height: 1000 } });
	const a = await ctxA.newPage();
	const b = await ctxB.newPage();
	await signUpFresh(a, 'Saskia Obuya');
	const sheetId = await newSheet(a, rc('1k'), 'Answer spec RC');
	const { email: emailB } = await signUpFresh(b, 'Jun Halvorsen');
	expect(
		(
			await a.request.post(`/api/sheets/${sheetId}/grants`, {
				data: { email: emailB, role: 'commenter' }
			})
		).status()
	).toBe(201);
	expect(
		(
			await a.request.put(`/api/sheets/${sheetId}/revisions`, {
				data: { baseRevision: 1, document: rc('2k') }
			})
		).status()
	).toBe(201);
	expect(
		(
			await a.request.put(`/api/design/sheets/${sheetId}/settings`, {
				data: { spec: { bandwidthMin: 100e3 } }
			})
		).status()
	).toBe(200);
	expect(
		(
			await a.request.post(`/api/sheets/${sheetId}/reviews`, {
				data: { reviewers: [emailB], message: 'Bandwidth check, please.', revision: 2 }
			})
		).status()
	).toBe(201);

	await openSheet(b, sheetId);
	const jump = b.getByRole('navigation', { name: 'On this sheet' }).getByTestId('jump-review');
	await expect(jump).toContainText('your answer is asked for revision 2');
	await b.screenshot({ path: artifact('review-jump-nav.png'), clip: { x: 0, y: 0, width: 1400, height: 260 } });
	await jump.click();
	const mine = b.getByRole('region', { name: 'Your review' });
	await expect(mine).toBeInViewport();
	const spec = mine.getByTestId('answer-spec');
	await expect(spec).toContainText('Spec limits, revision 1 → 2');
	await expect(spec.getByTestId('answer-spec-verdict')).toHaveText('✗ not all met');
	const bw = spec.locator('[data-spec="bandwidth"]');
	await expect(bw).toContainText('≥ 100 kHz');
	await expect(bw).toContainText('▼ now misses');
	await expect(bw).toContainText('r1: 159.2 kHz ✓ meets');
	await expect(bw).toContainText('r2: 79.58 kHz ✗ misses');
	await b.screenshot({ path: artifact('review-answer-spec.png') });
	await spec.getByRole('link', { name: 'Compare revision 1 with 2' }).click();
	await expect(b.getByRole('table', { name: 'Spec limits before and after' })).toBeVisible();
	await ctxA.close();
	await ctxB.close();
});
