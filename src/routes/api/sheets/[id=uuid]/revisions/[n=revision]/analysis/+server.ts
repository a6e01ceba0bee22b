// GET /api/sheets/:id/revisions/:n/analysis — poles, zeros, responses and time constants of a
// stored revision (readers of the sheet; 422 when the solver refuses the network).
import { apiActor, endpoint } from '$lib/server/api/respond';
import { analysisResponse } from '$lib/server/sharing/stored-analysis';

export const GET = endpoint(async (event) => analysisResponse(apiActor(event), event.params.id!, Number(event.params.n)));
