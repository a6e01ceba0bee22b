import { ELEMENT_TYPES } from '../network/schema';
import { SolverError } from './errors';

/**
 * Shape-level checks around the zod schema: the few mistakes zod would describe in its own
 * words are caught first so the message names the element, and zod's first issue is mapped to
 * a SolverError code with the element id when the path points into `elements`.
 */
const KNOWN = new Set<string>(ELEMENT_TYPES);

/** Catches the mistakes zod would report vaguely, so the message names the element. */
export function preflight(doc: unknown): void {
	if (typeof doc !== 'object' || doc === null || Array.isArray(doc)) {
		throw new SolverError('bad_document', 'the network document must be a JSON object');
	}
	const els = (doc as { elements?: unknown }).elements;
	if (Array.isArray(els) && els.length === 0) {
		throw new SolverError('empty_network', 'the network has no elements');
	}
	if (!Array.isArray(els)) return;
	for (const e of els) {
		if (typeof e !== 'object' || e === null) continue;
		const { id, type, value } = e as { id?: unknown; type?: unknown; value?: unknown };
		const name = typeof id === 'string' ? id : '?';
		if (typeof type === 'string' && !KNOWN.has(type)) {
			throw new SolverError('unknown_type', `element "${name}": unknown type "${type}"`, {
				element: name
			});
		}
		if (typeof value === 'number' && !Number.isFinite(value)) {
			throw new SolverError('non_finite', `element "${name}": value is not finite`, {
				element: name
			});
		}
	}
}

export function fromZod(
	doc: unknown,
	issue: { path: PropertyKey[]; message: string }
): SolverError {
	const path = issue.path;
	if (path[0] === 'elements' && typeof path[1] === 'number') {
		const raw = (doc as { elements: Record<string, unknown>[] }).elements[path[1]];
		const id = typeof raw?.id === 'string' ? raw.id : `#${path[1] + 1}`;
		const field = String(path[2] ?? '');
		const code = field === 'value' ? 'bad_value' : field === 'nodes' ? 'bad_nodes' : 'bad_document';
		return new SolverError(code, `element "${id}": ${field || 'entry'}: ${issue.message}`, {
			element: id
		});
	}
	return new SolverError('bad_document', `${path.join('.') || 'document'}: ${issue.message}`);
}
