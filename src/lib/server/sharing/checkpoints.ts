// Revision checkpoints. Autosave keeps every save as a revision (nothing is ever lost), but a
// history of 17 "name · time" rows for one ladder says nothing. The history groups saves into
// checkpoints: a run of saves by one person with no pause longer than PAUSE_MS between them.
// A checkpoint ends at an explicit one — a revision that was named, saved with a message, or
// marked from the editor (Ctrl+S) — and at every revision something points at (a comment, a
// review request or sign-off, a meeting item), so those are never folded into a group: each
// stays the end of its own checkpoint.
// Each checkpoint says what changed from the one before it: "Ctop 6.8p → 6.67p; added R4".
// Pure: the data layer loads revisions and references; this only groups and words them.
import type { NetworkDocument } from '../../network/schema';
import { sameValue, wiring } from '../review/wiring';

export const PAUSE_MS = 5 * 60 * 1000;

export interface RevisionForHistory {
	number: number;
	authorId: string | null;
	authorName: string | null;
	createdAt: Date | string;
	message: string | null;
	name: string | null;
	/** Marked as a checkpoint by a person (the editor's explicit save). */
	checkpoint?: boolean;
	document: NetworkDocument;
}

export type ReferenceKind = 'comment' | 'review' | 'meeting';

export interface Checkpoint {
	/** The revision that stands for the checkpoint (its last save). */
	number: number;
	first: number;
	/** Every revision in it, newest first. */
	revisions: {
		number: number;
		createdAt: Date | string;
		message: string | null;
		name: string | null;
	}[];
	authorName: string | null;
	startedAt: Date | string;
	endedAt: Date | string;
	name: string | null;
	message: string | null;
	/** What points at the checkpoint's revision, in words' order. */
	referencedBy: ReferenceKind[];
	/** What changed from the checkpoint before ("Ctop 6.8p → 6.67p; added R4"), or how it began. */
	summary: string;
}

const time = (d: Date | string) => new Date(d).getTime();

/** Group revisions (any order) into checkpoints, newest first. */
export function groupCheckpoints(
	revisions: RevisionForHistory[],
	references: Map<number, Set<ReferenceKind>>
): Checkpoint[] {
	const asc = [...revisions].sort((a, b) => a.number - b.number);
	// Revision 1's automatic "Created" (db/sheets.ts) is not a message anyone wrote: the first
	// edits after creating a sheet belong with it.
	const written = (r: RevisionForHistory) => !!r.message && !(r.number === 1 && r.message === 'Created');
	const ends = (r: RevisionForHistory) =>
		!!r.checkpoint || !!r.name || written(r) || references.has(r.number);
	const groups: RevisionForHistory[][] = [];
	for (const r of asc) {
		const g = groups.at(-1);
		const prev = g?.at(-1);
		const joins =
			!!prev &&
			!ends(prev) &&
			prev.authorId === r.authorId &&
			time(r.createdAt) - time(prev.createdAt) <= PAUSE_MS;
		if (joins) g!.push(r);
		else groups.push([r]);
	}
	const byNumber = new Map(asc.map((r) => [r.number, r]));
	return groups
		.map((g) => {
			const last = g.at(-1)!;
			const before = byNumber.get(g[0].number - 1);
			return {
				number: last.number,
				first: g[0].number,
				revisions: [...g]
					.reverse()
					.map((r) => ({
						number: r.number,
						createdAt: r.createdAt,
						message: r.message,
						name: r.name
					})),
				authorName: last.authorName,
				startedAt: g[0].createdAt,
				endedAt: last.createdAt,
				name: last.name,
				message: last.message,
				referencedBy: (['review', 'comment', 'meeting'] as const).filter((k) =>
					references.get(last.number)?.has(k)
				),
				summary: before
					? changeSummary(before.document, last.document)
					: startSummary(last.document)
			};
		})
		.reverse();
}

const val = (v: unknown) => (v === undefined ? '—' : String(v));

/** "Ctop 6.8p → 6.67p; added R4; removed R2; R1 rewired" — what a reviewer scans for. */
export function changeSummary(a: NetworkDocument, b: NetworkDocument, limit = 6): string {
	const before = new Map(a.elements.map((e) => [e.id, e]));
	const after = new Map(b.elements.map((e) => [e.id, e]));
	const both = new Set([...before.keys()].filter((id) => after.has(id)));
	const [wa, wb] = [wiring(a, both), wiring(b, both)];
	const parts: string[] = [];
	for (const [id, e] of after) {
		const old = before.get(id);
		if (!old) parts.push(`added ${id}`);
		else {
			if (old.type !== e.type) parts.push(`${id} ${old.type} → ${e.type}`);
			else if (!sameValue(old.value, e.value))
				parts.push(`${id} ${val(old.value)} → ${val(e.value)}`);
			if (wa.get(id) !== wb.get(id)) parts.push(`${id} rewired`);
			if ((old.role ?? 'design') !== (e.role ?? 'design'))
				parts.push(
					`${id} now ${e.role === 'fixed' ? 'a fixed value' : e.role === 'trimmer' ? 'a trimmer' : 'a design value'}`
				);
		}
	}
	for (const id of before.keys()) if (!after.has(id)) parts.push(`removed ${id}`);
	if (a.input !== b.input) parts.push(`input ${a.input} → ${b.input}`);
	if (
		String(a.output.node) !== String(b.output.node) ||
		String(a.output.reference ?? 'gnd') !== String(b.output.reference ?? 'gnd')
	)
		parts.push(`output ${a.output.node} → ${b.output.node}`);
	if (!parts.length) return 'drawing moved; the network is the same';
	return parts.length > limit
		? `${parts.slice(0, limit).join('; ')}; and ${parts.length - limit} more`
		: parts.join('; ');
}

function startSummary(doc: NetworkDocument): string {
	const n = doc.elements.length;
	return n ? `created with ${n} part${n === 1 ? '' : 's'}` : 'created empty';
}
