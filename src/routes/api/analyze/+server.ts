// POST /api/analyze: a network document in, the analysis out (signed-in session or API token).
// The solver runs in the worker pool under a time limit, so one large network never holds up
// other requests.
import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiActor, endpoint, problem, readBody } from '$lib/server/api/respond';
import { checkDocument, LIMITS, readOptions } from '$lib/server/analysis-request';
import { analyzeInPool } from '$lib/server/jobs/analysis-pool';

export const POST = endpoint(async (event) => {
	apiActor(event);
	const options = readOptions(event.url);
	const document = checkDocument(await readBody(event.request, z.unknown(), LIMITS.bodyBytes));
	const outcome = await analyzeInPool({ document, options });
	if (!outcome.ok) {
		const { error, ...where } = outcome.error;
		return problem(422, error, where);
	}
	return json(outcome.analysis);
});
