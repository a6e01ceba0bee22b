// POST /api/design/variant-spec — every variant of the document against the spec limits, and the
// cross-variant specs (equal within a tolerance, ratios between options), on exact figures.
import { designEndpoint } from '../handler';
import { variantSpecBody } from '../schema';

export const POST = designEndpoint(variantSpecBody, (body, document) => ({
	kind: 'variant-spec',
	document,
	spec: body.spec,
	across: body.across
}));
