// POST /api/design/sensitivity — normalized sensitivity of each pole, the bandwidth and the DC
// gain to every element value, ranked.
import { designEndpoint } from '../handler';
import { documentBody } from '../schema';

export const POST = designEndpoint(documentBody, (_body, document) => ({
	kind: 'sensitivity',
	document
}));
