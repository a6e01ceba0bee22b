// POST /api/analyze: a network document in, the analysis out (signed-in session or API token).
// The solver runs in the worker pool under a time limit, so one large network never holds up
// other requests. Query options: points, fMin, fMax, stepPoints, tEnd, response=0, step=0 (what is
// computed) and omit=impedanceCurve,groupDelay,expansion, matrixPorts=N (what is sent back; see
// analysis-omit.ts). Without them the whole analysis comes back. A document with variants is
// analysed as its base network, as one variant (variant=NAME) or as all of them (variants=all,
// answered as { variants: [{ name, options, analysis, error }] }).
import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { apiActor, endpoint, problem, readBody } from '$lib/server/api/respond';
import { checkDocument, LIMITS, readOptions } from '$lib/server/analysis-request';
import { analyzeInPool, shedEarly } from '$lib/server/jobs/analysis-pool';
import { readTrim, skipped, trimAnalysis } from '$lib/server/analysis-omit';
import { analyzeVariants, readVariantChoice, variantsFor } from '$lib/server/variant-analysis';
import type { Analysis } from '$lib/solver';

export const POST = endpoint(async (event) => {
	apiActor(event);
	// Under overload, refuse before reading and checking the body: shedding must stay cheap.
	shedEarly();
	const options = readOptions(event.url);
	const trim = readTrim(event.url);
	const choice = readVariantChoice(event.url);
	const document = checkDocument(await readBody(event.request, z.unknown(), LIMITS.bodyBytes));
	// What will not be sent is not computed either (the expansion and the impedance curve are
	// the costly ones); trimAnalysis then shapes the answer.
	const solverOptions = { ...options, ...skipped(trim) };
	if (choice.kind !== 'base') {
		const outcomes = await analyzeVariants(document, variantsFor(document, choice), solverOptions);
		const trimmed = outcomes.map((o) => ({
			...o,
			analysis: o.analysis ? trimAnalysis(o.analysis as Analysis, trim) : null
		}));
		if (choice.kind === 'all') return json({ variants: trimmed });
		const [one] = trimmed;
		if (one.error) {
			const { error, ...where } = one.error;
			return problem(422, `variant "${one.name}": ${error}`, { ...where, variant: one.name });
		}
		return json(one.analysis);
	}
	// The worker trims and writes the JSON itself: this thread only passes the text on.
	const outcome = await analyzeInPool({
		document,
		options: solverOptions,
		asJson: { omit: [...trim.omit], matrixPorts: trim.matrixPorts }
	});
	if (!outcome.ok) {
		const { error, ...where } = outcome.error;
		return problem(422, error, where);
	}
	return new Response(outcome.json, { headers: { 'content-type': 'application/json' } });
});
