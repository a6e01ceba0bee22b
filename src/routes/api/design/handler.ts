// One shape for the synchronous design endpoints: signed-in caller, body within the limit,
// the document through the analysis front door (its size and element limits, its shape check
// naming the element), then the task in the design worker pool.
import { json, type RequestHandler } from '@sveltejs/kit';
import type { z } from 'zod';
import { apiActor, BODY_LIMITS, endpoint, readBody } from '$lib/server/api/respond';
import { checkDesignNetwork } from '$lib/server/jobs/design-service';
import { runDesign, shedDesignEarly } from '$lib/server/jobs/design-pool';
import type { DesignTask } from '$lib/server/workers/design.worker';

export function designEndpoint<S extends z.ZodType<{ document: unknown }>>(
	schema: S,
	task: (body: z.output<S>, document: unknown) => DesignTask,
	respond: (value: unknown, url: URL) => Response = (value) => json(value)
): RequestHandler {
	return endpoint(async (event) => {
		apiActor(event);
		// Under overload, refuse before reading and checking the body (as POST /api/analyze).
		shedDesignEarly();
		const body = await readBody(event.request, schema, BODY_LIMITS.document);
		const document = checkDesignNetwork(body.document);
		return respond(await runDesign(task(body, document)), event.url);
	});
}
