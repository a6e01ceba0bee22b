// GET /api/sheets/:id/reviews/activity — the sheet's activity: saves, shares, comments, review
// requests and answers, newest first.
import { json } from '@sveltejs/kit';
import { authorizeSheet } from '$lib/server/access';
import { apiActor, endpoint } from '$lib/server/api/respond';
import { listActivity } from '$lib/server/db/activity';

export const GET = endpoint(async (event) => {
	const { sheet } = await authorizeSheet(apiActor(event), event.params.id!, 'read');
	return json({ activity: await listActivity({ sheetId: sheet.id }) });
});
