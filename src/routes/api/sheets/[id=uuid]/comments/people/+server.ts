// GET /api/sheets/:id/comments/people — who can be mentioned (workspace members and the sheet's
// guests), each with the handle to write after @.
import { json } from '@sveltejs/kit';
import { apiActor, endpoint } from '$lib/server/api/respond';
import { mentionCandidates } from '$lib/server/review/comment-actions';

export const GET = endpoint(async (event) => json({ people: await mentionCandidates(apiActor(event), event.params.id!) }));
