// Undo/redo of typed values and drawing changes, and a reload after autosave shows the same
// circuit in the same places.
import { expect, test } from '@playwright/test';
import { newSheet, node, openSheet, setValue, signUpFresh, RC_LOW_PASS } from './editor-helpers';

const RC = RC_LOW_PASS;

test('undo and redo walk edits back and forth; a reload after autosave shows the same circuit', async ({
	page
}) => {
	test.setTimeout(60_000);
	await signUpFresh(page);
	const id = await newSheet(page, RC, 'History');
	await openSheet(page, id);
	const saved = page.locator('[data-save-status]');
	await expect(saved).toHaveAttribute('data-save-status', 'saved');

	await setValue(page, 'R1', '2.2k');
	await expect(node(page, 'R1')).toContainText('2.2 kΩ');
	// C1 hangs upright to ground in the automatic layout; a quarter turn lays it flat.
	const upright = async () => {
		const b = (await node(page, 'C1').boundingBox())!;
		return b.height > b.width;
	};
	expect(await upright()).toBe(true);
	await node(page, 'C1').click();
	await page.keyboard.press('r'); // turn C1
	await expect.poll(upright).toBe(false);

	await page
		.getByRole('application', { name: 'Schematic canvas', exact: true })
		.click({ position: { x: 5, y: 5 } });
	await page.keyboard.press('Control+z'); // undo the turn
	await expect.poll(upright).toBe(true);
	await page.keyboard.press('Control+z'); // undo the value
	await expect(node(page, 'R1')).toContainText('1 kΩ');
	await page.keyboard.press('Control+Shift+z');
	await expect(node(page, 'R1')).toContainText('2.2 kΩ');
	await page.keyboard.press('Control+y');
	await expect.poll(upright).toBe(false);

	// Move R1 by dragging it, then wait for the save and reload.
	const r1 = (await node(page, 'R1').boundingBox())!;
	await page.mouse.move(r1.x + r1.width / 2, r1.y + r1.height / 2);
	await page.mouse.down();
	await page.mouse.move(r1.x + r1.width / 2 + 60, r1.y + r1.height / 2 + 80, { steps: 6 });
	await page.mouse.up();
	await expect(saved).toHaveAttribute('data-save-status', 'saved');
	const before = await page
		.locator('.svelte-flow__node')
		.evaluateAll((els) =>
			els
				.map(
					(e) =>
						`${e.querySelector('[data-name]')?.getAttribute('data-name')}@${(e as HTMLElement).style.transform}`
				)
				.sort()
		);
	const revision = await saved.getAttribute('data-revision');
	expect(Number(revision)).toBeGreaterThan(1);

	await page.reload();
	await expect(node(page, 'R1')).toContainText('2.2 kΩ');
	await expect(saved).toHaveAttribute('data-revision', revision!);
	const after = await page
		.locator('.svelte-flow__node')
		.evaluateAll((els) =>
			els
				.map(
					(e) =>
						`${e.querySelector('[data-name]')?.getAttribute('data-name')}@${(e as HTMLElement).style.transform}`
				)
				.sort()
		);
	expect(after).toEqual(before);
	expect(await upright()).toBe(false);
});
