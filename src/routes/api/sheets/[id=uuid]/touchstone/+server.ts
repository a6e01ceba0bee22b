// GET /api/sheets/:id/touchstone?port1=a,gnd&port2=b,gnd&parameter=S&format=RI&unit=Hz&z0=50
// &fMin=…&fMax=…&points=…&spacing=log|linear (or &frequencies=1e3,1e4,…)[&revision=n] — the
// two-port as a Touchstone .s2p download; POST takes the same fields as JSON. 422 when Z or Y
// do not exist for the two-port, or a port names a node the network does not have.
import { z } from 'zod';
import { apiActor, endpoint, readBody } from '$lib/server/api/respond';
import { fileResponse } from '$lib/server/exchange/serve';
import {
	queryToInput,
	readTouchstoneQuery,
	touchstoneAs
} from '$lib/server/exchange/touchstone-actions';

async function answer(event: Parameters<Parameters<typeof endpoint>[0]>[0], input: unknown) {
	const { text, fileName } = await touchstoneAs(
		apiActor(event),
		event.params.id!,
		event.url,
		readTouchstoneQuery(input)
	);
	return fileResponse(text, 'text/plain; charset=us-ascii', fileName);
}

export const GET = endpoint(async (event) => answer(event, queryToInput(event.url)));

export const POST = endpoint(async (event) => {
	apiActor(event);
	return answer(event, await readBody(event.request, z.record(z.string(), z.unknown())));
});
