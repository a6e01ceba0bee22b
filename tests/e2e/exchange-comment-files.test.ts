// Files on comments from the review panel: chosen with the keyboard in the composer, sent with
// the comment; the server decides the type from the bytes and its refusal is shown in its own
// words; stored images show as thumbnails from the safe route, every file as a download link
// with name, type and size.
import { deflateSync, crc32 } from 'node:zlib';
import { expect, test } from '@playwright/test';
import { lowPass, sheetWith, signInAs } from './exchange-support';
import { artifact } from './artifacts';

/** A w×h RGB PNG (PNG specification: signature, IHDR, one zlib IDAT, IEND; CRC-32 per chunk). */
function png(w: number, h: number): Buffer {
	const chunk = (type: string, data: Buffer) => {
		const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
		const out = Buffer.alloc(body.length + 8);
		out.writeUInt32BE(data.length, 0);
		body.copy(out, 4);
		out.writeUInt32BE(crc32(body) >>> 0, body.length + 4);
		return out;
	};
	const ihdr = Buffer.alloc(13);
	ihdr.writeUInt32BE(w, 0);
	ihdr.writeUInt32BE(h, 4);
	ihdr.set([8, 2, 0, 0, 0], 8); // 8 bits, truecolour
	const rows = Buffer.alloc(h * (1 + 3 * w));
	for (let y = 0; y < h; y++)
		for (let x = 0; x < w; x++)
			rows.set([40, 120 + 4 * y, 200 - 6 * x], y * (1 + 3 * w) + 1 + 3 * x);
	return Buffer.concat([
		Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
		chunk('IHDR', ihdr),
		chunk('IDAT', deflateSync(rows)),
		chunk('IEND', Buffer.alloc(0))
	]);
}

test('comment attachments: keyboard attach, server refusal shown, thumbnail and download', async ({
	page
}) => {
	await page.setViewportSize({ width: 1500, height: 1000 });
	await signInAs(page);
	const { sheetId } = await sheetWith(page, lowPass, 'RC low-pass, scope shots');
	await page.goto(`/sheets/${sheetId}`);
	await page.waitForLoadState('networkidle');
	const review = page.getByRole('region', { name: 'Review' });
	const composer = review.getByRole('form', { name: 'New comment' });
	const text = composer.getByLabel('Comment', { exact: true });
	await text.fill('Scope shot of the 100 kHz step attached.');

	// Keyboard only: Tab from the text reaches the attach button, Enter opens the file picker.
	const attach = composer.getByRole('button', { name: 'Attach a file' });
	await text.press('Tab');
	await expect(attach).toBeFocused();
	const chooser = page.waitForEvent('filechooser');
	await page.keyboard.press('Enter');
	await (
		await chooser
	).setFiles([
		{ name: 'step-100k.png', mimeType: 'image/png', buffer: png(24, 16) },
		// A web page named .png: the browser says image/png, the bytes say otherwise.
		{
			name: 'notes.png',
			mimeType: 'image/png',
			buffer: Buffer.from('<!doctype html><script>alert(1)</script>')
		}
	]);
	const toAttach = composer.getByRole('list', { name: 'Files to attach' });
	await expect(toAttach).toContainText('step-100k.png');
	await expect(toAttach).toContainText('notes.png');

	// Over the server's limit (5 MB here): refused on the spot, in the server's words, not sent.
	const more = page.waitForEvent('filechooser');
	await attach.click();
	await (
		await more
	).setFiles({
		name: 'burst.png',
		mimeType: 'image/png',
		buffer: Buffer.alloc(5 * 1024 * 1024 + 1)
	});
	await expect(composer.getByRole('alert')).toHaveText(
		'“burst.png” was not attached: the file is over the 5 MB upload limit.'
	);
	await expect(toAttach).not.toContainText('burst.png');
	await composer.getByRole('button', { name: 'Post comment' }).click();

	await expect(composer.getByRole('alert')).toHaveText(
		"“notes.png” was not attached: Only PNG, JPEG, GIF, WebP images and PDF documents can be attached; the file's content is none of them."
	);
	const thread = review.getByTestId('comment-thread').filter({ hasText: 'Scope shot' });
	const files = thread.getByRole('list', { name: 'Files attached to this comment' });
	const link = files.getByRole('link', { name: 'step-100k.png' });
	await expect(link).toBeVisible();
	await expect(files).toContainText(/PNG · \d+ B/);
	await expect(files).not.toContainText('notes.png');
	// The thumbnail really loads from the safe route (24 px wide, as made).
	const thumb = files.locator('img');
	await expect.poll(() => thumb.evaluate((i: HTMLImageElement) => i.naturalWidth)).toBe(24);
	const served = await page.request.get((await link.getAttribute('href'))!);
	expect(served.headers()['content-type']).toBe('image/png');
	expect(served.headers()['content-disposition']).toMatch(/^attachment; filename="step-100k.png"/);
	expect(served.headers()['x-content-type-options']).toBe('nosniff');

	// The author can add a file to the comment later (a PDF datasheet), and it survives a reload.
	const later = page.waitForEvent('filechooser');
	await thread.getByRole('button', { name: 'Attach a file' }).click();
	await (
		await later
	).setFiles({
		name: 'C0G-datasheet.pdf',
		mimeType: 'application/pdf',
		buffer: Buffer.from('%PDF-1.4\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n')
	});
	await expect(files.getByRole('link', { name: 'C0G-datasheet.pdf' })).toBeVisible();
	await page.reload();
	await expect(files.getByRole('link', { name: 'step-100k.png' })).toBeVisible();
	await expect(files).toContainText(/PDF · \d+ B/);
	await thread.scrollIntoViewIfNeeded();
	await page.screenshot({ path: artifact('comment-files.png') });
	await thread.screenshot({ path: artifact('comment-files-thread.png') });
});
