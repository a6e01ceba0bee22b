// POST /api/design/solve — the value of one element that meets a goal (flat response, target
// bandwidth, Q, overshoot or DC gain), its preferred-value neighbours, before/after curves.
import { designEndpoint } from '../handler';
import { solveBody } from '../schema';

export const POST = designEndpoint(solveBody, (body, document) => ({
	kind: 'solve',
	document,
	request: { element: body.element, goal: body.goal, range: body.range, series: body.series }
}));
