// POST /api/design/worst-case — extremes of every figure over the tolerance box (all corners,
// or the sensitivity-guided vertices), and the spec outcome at the worst vertex.
import { designEndpoint } from '../handler';
import { worstCaseBody } from '../schema';

export const POST = designEndpoint(worstCaseBody, (body, document) => ({
	kind: 'worst-case',
	document,
	request: { tolerances: body.tolerances, method: body.method, spec: body.spec }
}));
