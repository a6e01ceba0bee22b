// GET /api/sheets/:id/revisions/:n/analysis — poles, zeros, responses and time constants of a
// stored revision (readers of the sheet; 422 when the solver refuses the network). A sheet with
// variants: ?variant=NAME for one, ?variants=all for every one (as POST /api/analyze).
import { apiActor, endpoint } from '$lib/server/api/respond';
import { analysisResponse } from '$lib/server/sharing/stored-analysis';
import { readVariantChoice } from '$lib/server/variant-analysis';

export const GET = endpoint(async (event) =>
	analysisResponse(
		apiActor(event),
		event.params.id!,
		Number(event.params.n),
		readVariantChoice(event.url)
	)
);
