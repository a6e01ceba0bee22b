// GET /api/sheets/:id/attachments — the sheet's files (?comment=<id> one comment's, ?comment=all
// every one) and the upload limit in bytes, so a browser can refuse an oversize file before
// sending it; POST (multipart: file, optional commentId) — attach a PNG, JPEG, GIF, WebP or PDF:
// 413 over the upload limit, 415 when the content is another type or the name claims one.
import { json } from '@sveltejs/kit';
import { apiActor, endpoint } from '$lib/server/api/respond';
import { requireId } from '$lib/server/api/ids';
import { listAttachmentsAs, uploadAttachmentAs } from '$lib/server/exchange/attachment-actions';
import { readUpload } from '$lib/server/exchange/upload';
import { uploadLimit } from '$lib/server/exchange/limits';

export const GET = endpoint(async (event) => {
	const raw = event.url.searchParams.get('comment');
	const comment = raw === null || raw === 'all' ? raw : requireId(raw, 'comment', 'query');
	return json({
		attachments: await listAttachmentsAs(apiActor(event), event.params.id!, comment ?? null),
		uploadLimitBytes: uploadLimit()
	});
});

export const POST = endpoint(async (event) => {
	const actor = apiActor(event);
	const upload = await readUpload(event.request, event.url);
	return json(
		{ attachment: await uploadAttachmentAs(actor, event.params.id!, upload) },
		{ status: 201 }
	);
});
