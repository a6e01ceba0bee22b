// Where a comment points, and whether that place still looks as it did. A comment keeps the
// revision it was written on and a snapshot of its anchor; on every later revision it is
// compared, so a comment on a capacitor that was since changed or deleted still shows, marked as
// being about an earlier revision.
import { z } from 'zod';
import type { NetworkDocument, NetworkElement } from '../../network/schema';
import type { AnchorKind } from '../db/models/comment';
import { elementUnchanged, netStatus, sameNetwork } from './wiring';

const ref = z.string().trim().min(1, 'anchor.ref is required for this kind').max(64, 'anchor.ref is at most 64 characters');
// A result row's snapshot comes from the browser's analysis; only a few bounded numbers are kept.
const num = z.number().finite().nullable().optional();
const resultSnapshot = z.object({ re: num, im: num, hz: num, value: num, label: z.string().max(80).optional(), owners: z.array(z.string().max(64)).max(12).optional() }).optional();

export const anchorSchema = z.discriminatedUnion('kind', [
	z.object({ kind: z.literal('sheet') }),
	z.object({ kind: z.literal('element'), ref }),
	z.object({ kind: z.literal('net'), ref }),
	z.object({ kind: z.literal('time_constant'), ref }),
	z.object({ kind: z.literal('pole'), ref, snapshot: resultSnapshot }),
	z.object({ kind: z.literal('zero'), ref, snapshot: resultSnapshot }),
	z.object({ kind: z.literal('spec'), ref, snapshot: resultSnapshot })
], { error: 'anchor.kind must be one of sheet, element, net, time_constant, pole, zero, spec' });
export type AnchorInput = z.infer<typeof anchorSchema>;

/** Whether the anchor is as it was: `changed` and `removed` mean the comment is about an earlier revision. */
export type AnchorStatus = 'current' | 'changed' | 'removed';

const netName = (n: string | number) => (String(n) === '0' ? 'gnd' : String(n));

function elementFacts(e: NetworkElement) {
	return { type: e.type, value: e.value === undefined ? null : String(e.value), nodes: e.nodes.map(netName), control: e.control ?? null };
}

export class AnchorProblem extends Error {}

/** The snapshot stored with a new comment; throws AnchorProblem when the anchor is not in the revision. */
export function snapshotAnchor(anchor: AnchorInput, doc: NetworkDocument, revision: number): unknown {
	switch (anchor.kind) {
		case 'sheet':
			return null;
		case 'element':
		case 'time_constant': {
			const e = doc.elements.find((x) => x.id === anchor.ref);
			if (!e) throw new AnchorProblem(`anchor.ref: revision ${revision} has no element "${anchor.ref}"`);
			return elementFacts(e);
		}
		case 'net': {
			const nets = new Set(doc.elements.flatMap((e) => e.nodes.map(netName)));
			if (!nets.has(netName(anchor.ref))) throw new AnchorProblem(`anchor.ref: revision ${revision} has no net "${anchor.ref}"`);
			return { net: netName(anchor.ref) };
		}
		default:
			return anchor.snapshot ?? null;
	}
}

export function anchorStatus(
	kind: AnchorKind,
	anchorRef: string | null,
	_snapshot: unknown,
	written: NetworkDocument,
	latest: NetworkDocument
): AnchorStatus {
	if (kind === 'sheet') return 'current';
	if (kind === 'element' || kind === 'time_constant') {
		const same = elementUnchanged(anchorRef ?? '', written, latest);
		return same === null ? 'removed' : same ? 'current' : 'changed';
	}
	if (kind === 'net') return netStatus(anchorRef ?? '', written, latest);
	// Poles, zeros and spec lines depend on the whole network: any change to it may move them.
	return sameNetwork(written, latest) ? 'current' : 'changed';
}
