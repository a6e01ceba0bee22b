// GET /api/sheets/:id/attachments/:aid — the file, as a download (?inline=1 shows an image in
// the browser, sandboxed); DELETE — remove it.
import { apiActor, endpoint } from '$lib/server/api/respond';
import { attachmentFileAs, deleteAttachmentAs } from '$lib/server/exchange/attachment-actions';
import { fileResponse } from '$lib/server/exchange/serve';

export const GET = endpoint(async (event) => {
	const a = await attachmentFileAs(apiActor(event), event.params.id!, event.params.attachmentId!);
	return fileResponse(a.data, a.contentType, a.fileName, {
		inline: event.url.searchParams.get('inline') === '1'
	});
});

export const DELETE = endpoint(async (event) => {
	await deleteAttachmentAs(apiActor(event), event.params.id!, event.params.attachmentId!);
	return new Response(null, { status: 204 });
});
