// "Too large for an interactive analysis" — one decision, used by every route that runs the
// solver (analysis, stored revisions, exports, the report, comparisons, design aids), so the
// documented limits and what completes agree. The cost of an analysis grows with the number of
// capacitors and inductors (its eigenproblem is about that size; measured in docs/performance.md:
// 500 in ~4 s, 1000 in ~18 s on the shared 2-core machine under load), far less with resistors
// (3000 elements with 95 capacitors: 1.5 s). The limits are settings (config: ANALYSIS_MAX_*),
// and this function is the one place to change what "too large" means — e.g. to send a large
// network to the job queue instead of refusing it.
import { ApiProblem } from './api/respond';
import { config } from './config';

export interface NetworkSize {
	elements: number;
	/** Capacitors and inductors. */
	reactive: number;
}

export function sizeOf(document: unknown): NetworkSize {
	const elements = (document as { elements?: unknown })?.elements;
	if (!Array.isArray(elements)) return { elements: 0, reactive: 0 };
	let reactive = 0;
	for (const e of elements) {
		const type = (e as { type?: unknown })?.type;
		if (type === 'C' || type === 'L') reactive++;
	}
	return { elements: elements.length, reactive };
}

export function interactiveLimits() {
	const c = config();
	return { elements: c.analysisMaxElements, reactive: c.analysisMaxReactive };
}

/** Null when the network may be analysed within a request; else why not, with the limit. */
export function tooLargeForInteractive(document: unknown): string | null {
	const size = sizeOf(document);
	const limit = interactiveLimits();
	if (size.elements > limit.elements)
		return `the network has ${size.elements} elements; an analysis is limited to ${limit.elements} elements (and ${limit.reactive} capacitors and inductors)`;
	if (size.reactive > limit.reactive)
		return `the network has ${size.reactive} capacitors and inductors; an analysis is limited to ${limit.reactive} of them (and ${limit.elements} elements)`;
	return null;
}

/** 413 with the limit in the message, before any work is queued. */
export function requireInteractive(document: unknown, what?: string): void {
	const reason = tooLargeForInteractive(document);
	if (reason) {
		const size = sizeOf(document);
		throw new ApiProblem(413, what ? `${what}: ${reason}` : reason, {
			code: 'too_large',
			elements: size.elements,
			reactive: size.reactive,
			limits: interactiveLimits()
		});
	}
}
