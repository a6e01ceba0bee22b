// Turning an HTTP request into an analysis task: the element limit, the document's shape check
// (naming the element at fault) and the response options, each problem an ApiProblem.
import { z } from 'zod';
import { networkDocumentSchema } from '../network/schema';
import type { AnalyzeOptions } from '../solver';
import { ApiProblem } from './api/problem';
import { config } from './config';
import { requireInteractive } from './analysis-limits';
import { INTERACTIVE_ELEMENT_LIMIT } from '../network/limits';

export const LIMITS = {
	bodyBytes: 1_000_000,
	/** Elements per analysis in a request (network/limits.ts; see analysis-limits.ts). */
	elements: INTERACTIVE_ELEMENT_LIMIT,
	get timeoutMs() {
		return config().analysisTimeoutMs;
	},
	frequencyPoints: 5000,
	stepPoints: 5000
};

/** Name the offending element when a shape problem sits inside `elements[i]`. */
function describeIssue(document: unknown, issue: z.core.$ZodIssue) {
	const [head, index, ...rest] = issue.path;
	const where = issue.path.join('.') || 'document';
	if (head === 'elements' && typeof index === 'number') {
		const raw = (document as { elements?: { id?: unknown }[] }).elements?.[index];
		const id = typeof raw?.id === 'string' ? raw.id : undefined;
		const field = rest.join('.') || 'element';
		const label = id ? `element "${id}"` : `elements[${index}]`;
		return { error: `${label}: ${field}: ${issue.message}`, ...(id ? { element: id } : {}) };
	}
	return { error: `${where}: ${issue.message}` };
}

export function checkDocument(document: unknown) {
	// Too large for a request: refused before the shape check reads every element.
	requireInteractive(document);
	const parsed = networkDocumentSchema.safeParse(document);
	if (!parsed.success) {
		const { error, ...extra } = describeIssue(document, parsed.error.issues[0]);
		throw new ApiProblem(400, error, { code: 'bad_document', ...extra });
	}
	return parsed.data;
}

const positive = (name: string, max: number) =>
	z.coerce
		.number({ error: `${name} must be a number` })
		.int(`${name} must be a whole number`)
		.min(2, `${name} must be at least 2`)
		.max(max, `${name} must be at most ${max}`);
const frequency = (name: string) =>
	z.coerce
		.number({ error: `${name} must be a number` })
		.positive(`${name} must be above 0 Hz`)
		.finite();

const optionsSchema = z
	.object({
		points: positive('points', LIMITS.frequencyPoints).optional(),
		fMin: frequency('fMin').optional(),
		fMax: frequency('fMax').optional(),
		stepPoints: positive('stepPoints', LIMITS.stepPoints).optional(),
		tEnd: z.coerce.number().positive('tEnd must be above 0 s').finite().optional(),
		response: z.enum(['0', '1']).optional(),
		step: z.enum(['0', '1']).optional(),
		doubletRatio: z.coerce
			.number({ error: 'doubletRatio must be a number' })
			.gt(0, 'doubletRatio must be above 0')
			.max(1, 'doubletRatio must be at most 1')
			.optional()
	})
	.refine(
		(o) => o.fMin === undefined || o.fMax === undefined || o.fMin < o.fMax,
		'fMin must be below fMax'
	);

/** Response options from the query string: ?points=&fMin=&fMax=&stepPoints=&tEnd=&response=0&step=0&doubletRatio= */
export function readOptions(url: URL): AnalyzeOptions {
	const parsed = optionsSchema.safeParse(Object.fromEntries(url.searchParams));
	if (!parsed.success)
		throw new ApiProblem(400, parsed.error.issues[0].message, { code: 'bad_options' });
	const o = parsed.data;
	return {
		frequency: o.response === '0' ? false : { points: o.points, fMin: o.fMin, fMax: o.fMax },
		step: o.step === '0' ? false : { points: o.stepPoints, tEnd: o.tEnd },
		...(o.doubletRatio !== undefined ? { doubletRatio: o.doubletRatio } : {})
	};
}
