// GET /api/sheets/:id/comments — the sheet's threads, each comment marked by whether its anchor
// still looks as it did on the latest revision; POST { body, anchor?, revision?, parentId? } — comment.
import { json } from '@sveltejs/kit';
import { apiActor, endpoint, readBody } from '$lib/server/api/respond';
import { requestContext } from '$lib/server/sharing/context';
import { addComment, commentThreads } from '$lib/server/review/comment-actions';
import { newCommentBody } from '$lib/server/review/schemas';

export const GET = endpoint(async (event) => {
	const { threads, latestRevision, canComment } = await commentThreads(apiActor(event), event.params.id!);
	return json({ threads, latestRevision, canComment }, { headers: { 'cache-control': 'no-store' } });
});

export const POST = endpoint(async (event) => {
	const actor = apiActor(event);
	const input = await readBody(event.request, newCommentBody);
	return json({ comment: await addComment(actor, event.params.id!, input, requestContext(event)) }, { status: 201 });
});
