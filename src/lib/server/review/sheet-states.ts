// The review state of many sheets at once, for the workspace's sheet list: the same state and
// the same words as the sheet page (state.ts), including "changed since sign-off" — decided,
// as on the sheet page, by comparing the signed-off revision's network with the latest one
// (sameNetwork), not by the revision count, so a save that only moved the drawing changes nothing.
import { db } from '../db/connection';
import type { NetworkDocument } from '../../network/schema';
import { sameNetwork } from './wiring';
import { stateOf, type ListReviewState } from './state';

interface Row {
	id: string;
	latestRevision: number;
}

// Revisions never change once written, so "did the network change between revision a and b of
// this sheet" can be remembered. Bounded: the oldest answers are dropped first.
const changedCache = new Map<string, boolean>();
const CACHE_LIMIT = 5000;

function remember(key: string, value: boolean) {
	changedCache.set(key, value);
	if (changedCache.size > CACHE_LIMIT) changedCache.delete(changedCache.keys().next().value!);
}

export async function reviewStates(rows: Row[]): Promise<Map<string, ListReviewState>> {
	const out = new Map<string, ListReviewState>();
	if (rows.length === 0) return out;
	const ids = rows.map((r) => r.id);
	// The newest request per sheet that was not withdrawn, with its reviewers' decisions.
	const [current] = (await db().query(
		`SELECT DISTINCT ON (r.sheet_id) r.sheet_id AS "sheetId", r.id, r.revision_number AS "revision",
		        coalesce(array_agg(a.decision) FILTER (WHERE a.id IS NOT NULL), '{}') AS decisions
		   FROM review_requests r LEFT JOIN review_answers a ON a.request_id = r.id
		  WHERE r.sheet_id IN (:ids) AND r.withdrawn_at IS NULL
		  GROUP BY r.sheet_id, r.id, r.revision_number, r.created_at
		  ORDER BY r.sheet_id, r.created_at DESC, r.id`,
		{ replacements: { ids } }
	)) as [{ sheetId: string; revision: number; decisions: ('approve' | 'changes' | null)[] }[], unknown];
	const bySheet = new Map(current.map((c) => [c.sheetId, c]));
	const toCompare: { sheetId: string; approved: number; latest: number; key: string }[] = [];
	for (const row of rows) {
		const c = bySheet.get(row.id);
		const state = stateOf(c ? c.decisions : null, c?.revision ?? null);
		out.set(row.id, state);
		if (state.state === 'signed_off' && state.approvedRevision! < row.latestRevision) {
			const key = `${row.id}:${state.approvedRevision}:${row.latestRevision}`;
			const known = changedCache.get(key);
			if (known === undefined)
				toCompare.push({ sheetId: row.id, approved: state.approvedRevision!, latest: row.latestRevision, key });
			else state.changedSinceApproval = known;
		}
	}
	if (toCompare.length) {
		const pairs = toCompare.flatMap((t) => [`${t.sheetId}:${t.approved}`, `${t.sheetId}:${t.latest}`]);
		const [docs] = (await db().query(
			`SELECT sheet_id AS "sheetId", number, document FROM sheet_revisions WHERE sheet_id || ':' || number IN (:pairs)`,
			{ replacements: { pairs } }
		)) as [{ sheetId: string; number: number; document: NetworkDocument }[], unknown];
		const doc = new Map(docs.map((d) => [`${d.sheetId}:${d.number}`, d.document]));
		for (const t of toCompare) {
			const a = doc.get(`${t.sheetId}:${t.approved}`);
			const b = doc.get(`${t.sheetId}:${t.latest}`);
			const changed = !!a && !!b && !sameNetwork(a, b);
			remember(t.key, changed);
			out.get(t.sheetId)!.changedSinceApproval = changed;
		}
	}
	return out;
}
