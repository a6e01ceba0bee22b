// POST /api/design/spec — pass/fail of a network against spec limits, with the figures.
import { designEndpoint } from '../handler';
import { specBody } from '../schema';

export const POST = designEndpoint(specBody, (body, document) => ({
	kind: 'spec',
	document,
	spec: body.spec
}));
