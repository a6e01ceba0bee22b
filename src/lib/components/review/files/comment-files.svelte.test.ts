// CommentFiles against a stubbed fetch: one request answers every comment that asks at once,
// files are grouped by comment (sheet files left out), the server's limit and refusals are
// passed on in words, and an oversize file is refused without being sent.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { CommentFiles, commentFilesOf, sizeText } from './comment-files.svelte';
import type { SheetReview } from '../sheet-review.svelte';

const review = { sheetId: 's1', me: 'u1' } as unknown as SheetReview;
const file = (id: string, commentId: string | null) => ({
	id,
	commentId,
	fileName: `${id}.png`,
	contentType: 'image/png',
	byteSize: 10,
	createdBy: 'u1',
	createdByName: 'Ines',
	createdAt: '2026-12-02T00:00:00Z'
});
const answer = (status: number, body: unknown) =>
	Promise.resolve(new Response(JSON.stringify(body), { status }));

afterEach(() => vi.unstubAllGlobals());

describe('CommentFiles', () => {
	it('fetches once for many asks, groups by comment and takes the server limit', async () => {
		const fetch = vi.fn(() =>
			answer(200, {
				attachments: [file('a', 'c1'), file('b', null), file('c', 'c1'), file('d', 'c2')],
				uploadLimitBytes: 2 * 1024 * 1024
			})
		);
		vi.stubGlobal('fetch', fetch);
		const files = new CommentFiles(review);
		files.sync();
		files.sync();
		files.sync();
		await vi.waitFor(() => expect(files.of('c1')).toHaveLength(2));
		expect(fetch).toHaveBeenCalledTimes(1);
		expect(fetch).toHaveBeenCalledWith('/api/sheets/s1/attachments?comment=all');
		expect(files.of('c2').map((f) => f.id)).toEqual(['d']);
		expect(files.of('nothing')).toEqual([]);
		expect(files.limitText).toBe('2 MB');
	});

	it('passes the server’s refusal on with the file name; an oversize file is not sent', async () => {
		const fetch = vi.fn(() =>
			answer(415, { error: 'Only PNG, JPEG, GIF, WebP images and PDF documents can be attached.' })
		);
		vi.stubGlobal('fetch', fetch);
		const files = new CommentFiles(review);
		expect(await files.upload('c1', new File(['<html>'], 'notes.png'))).toBe(
			'“notes.png” was not attached: Only PNG, JPEG, GIF, WebP images and PDF documents can be attached.'
		);
		const form = (fetch.mock.calls[0] as unknown as [string, RequestInit])[1].body as FormData;
		expect(form.get('commentId')).toBe('c1');
		fetch.mockClear();
		const big = new File([new Uint8Array(5 * 1024 * 1024 + 1)], 'burst.png');
		expect(await files.upload('c1', big)).toBe(
			'“burst.png” was not attached: the file is over the 5 MB upload limit.'
		);
		expect(fetch).not.toHaveBeenCalled();
	});

	it('adds a stored file to its comment, and keeps one set per review', async () => {
		vi.stubGlobal('fetch', () => answer(201, { attachment: file('n', 'c9') }));
		const files = commentFilesOf(review);
		expect(commentFilesOf(review)).toBe(files);
		expect(await files.upload('c9', new File(['x'], 'n.png'))).toBeNull();
		expect(files.of('c9').map((f) => f.id)).toEqual(['n']);
		expect([sizeText(748), sizeText(2048), sizeText(3 * 1024 * 1024)]).toEqual([
			'748 B',
			'2 KB',
			'3.0 MB'
		]);
	});
});
