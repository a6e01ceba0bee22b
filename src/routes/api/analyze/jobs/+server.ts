// POST /api/analyze/jobs — queue the analysis of a stored sheet revision as a background job:
// the route for networks above the interactive size (network/limits.ts), which POST
// /api/analyze refuses with 413. Body: { sheetId, revision?, poles? (1–500, default 10),
// near? (rad/s ≥ 0), points? (response points, 0 for none) }. 202 with the job; poll
// GET /api/design/jobs/:id for progress and the result ({ revision, analysis }); cancel with
// POST /api/design/jobs/:id/cancel.
import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiActor, endpoint, readBody } from '$lib/server/api/respond';
import { startLargeAnalysis } from '$lib/server/jobs/large-analysis';

const body = z.object({
	sheetId: z.string().uuid(),
	revision: z.number().int().positive().optional(),
	poles: z.number().int().min(1).max(500).optional(),
	near: z.number().min(0).finite().optional(),
	points: z.number().int().min(0).max(2000).optional()
});

export const POST = endpoint(async (event) => {
	const actor = apiActor(event);
	const input = await readBody(event.request, body);
	const job = await startLargeAnalysis(actor, input);
	return json({ job }, { status: 202, headers: { location: `/api/design/jobs/${job.id}` } });
});
