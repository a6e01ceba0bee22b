// GET /api/sheets — sheets shared with the caller one by one in workspaces they are not in.
import { json } from '@sveltejs/kit';
import { apiActor, endpoint } from '$lib/server/api/respond';
import { listGuestSheets } from '$lib/server/db/grants';

export const GET = endpoint(async (event) => json({ sheets: await listGuestSheets(apiActor(event).id) }));
