// POST /api/analyze: a network document in, the analysis out. The solver runs in the worker
// pool under a time limit, so one large network never holds up other requests.
import { json } from '@sveltejs/kit';
import { checkDocument, HttpProblem, LIMITS, readJsonBody, readOptions } from '$lib/server/analysis-request';
import { AnalysisTimeout, runAnalysis } from '$lib/server/jobs/analysis-pool';

export async function POST({ request, url }) {
	try {
		const options = readOptions(url);
		const document = checkDocument(await readJsonBody(request));
		const outcome = await runAnalysis({ document, options }, LIMITS.timeoutMs);
		if (!outcome.ok) return json(outcome.error, { status: 422 });
		return json(outcome.analysis);
	} catch (error) {
		if (error instanceof HttpProblem) return json({ error: error.message, ...error.extra }, { status: error.status });
		if (error instanceof AnalysisTimeout) return json({ error: error.message, code: 'timeout' }, { status: 503 });
		if (error instanceof Error && /queue is at limit/i.test(error.message)) {
			return json({ error: 'the server is busy with other analyses; try again in a moment', code: 'busy' }, { status: 503, headers: { 'retry-after': '2' } });
		}
		console.error('analysis failed', error);
		return json({ error: 'the analysis failed inside the server; the problem has been logged' }, { status: 500 });
	}
}
