// PATCH /api/sheets/:id/comments/:commentId { body?, resolved? } — edit your own comment, or
// resolve/reopen a thread; DELETE — delete your own comment (owners and admins may delete any).
import { json } from '@sveltejs/kit';
import { apiActor, endpoint, readBody } from '$lib/server/api/respond';
import { changeComment, removeComment, resolveThread } from '$lib/server/review/comment-actions';
import { changeCommentBody } from '$lib/server/review/schemas';

export const PATCH = endpoint(async (event) => {
	const actor = apiActor(event);
	const { body, resolved } = await readBody(event.request, changeCommentBody);
	const { id, commentId } = event.params as { id: string; commentId: string };
	let comment = body !== undefined ? await changeComment(actor, id, commentId, body) : null;
	if (resolved !== undefined) comment = await resolveThread(actor, id, commentId, resolved);
	return json({ comment });
});

export const DELETE = endpoint(async (event) => {
	await removeComment(apiActor(event), event.params.id!, event.params.commentId!);
	return new Response(null, { status: 204 });
});
