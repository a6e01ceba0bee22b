// "Too large for an interactive analysis" — one decision, used by every route that runs the
// solver in a request (analysis, stored revisions, exports, the report, comparisons, design
// aids), so the documented limits and what completes agree. Two bounds: the element count
// (INTERACTIVE_ELEMENT_LIMIT in network/limits.ts, shared with the editor and the job queue) and
// the number of capacitors and inductors, which sets the cost far more than resistors do
// (measured in docs/performance.md: a 3000-element resistor grid with 95 capacitors 1.5 s; an
// RC mesh with 1500 capacitors 47 s on the loaded 2-core machine). The second is a setting
// (ANALYSIS_MAX_REACTIVE). Background jobs (no caller) are not held to these: a large network's
// place is the job queue. This is the one place to change what "too large" means.
import { ApiProblem } from './api/respond';
import { config } from './config';
import { INTERACTIVE_ELEMENT_LIMIT } from '../network/limits';

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
	return { elements: INTERACTIVE_ELEMENT_LIMIT, reactive: config().analysisMaxReactive };
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
