// The activity feed of a sheet or a workspace. Review work (comments, requests, answers, meetings)
// is recorded in `activity`; saves come straight from the revision history and shares from the
// audit log, so neither has to be written twice.
import { db } from './connection';
import { reviewModels } from './models/review';

export type ActivityKind = 'saved' | 'shared' | 'commented' | 'review_requested' | 'review_answered' | 'meeting';

export interface ActivityRecord {
	kind: ActivityKind;
	sheetId: string | null;
	sheetName: string | null;
	actorName: string | null;
	detail: Record<string, unknown>;
	at: Date;
}

export async function recordActivity(row: { workspaceId: string; sheetId: string | null; actorId: string; kind: Exclude<ActivityKind, 'saved' | 'shared'>; detail?: Record<string, unknown> }) {
	await reviewModels().ActivityEntry.create({ ...row, detail: row.detail ?? {} });
}

export async function listActivity(scope: { workspaceId: string } | { sheetId: string }, limit = 50): Promise<ActivityRecord[]> {
	const bySheet = 'sheetId' in scope;
	const where = (alias: string) => (bySheet ? `${alias}.sheet_id = :id` : `s.workspace_id = :id`);
	const [rows] = await db().query(
		`SELECT * FROM (
		   SELECT 'saved' AS kind, r.sheet_id AS "sheetId", s.name AS "sheetName", u.name AS "actorName",
		          jsonb_build_object('revision', r.number, 'message', r.message) AS detail, r.created_at AS at
		     FROM sheet_revisions r JOIN sheets s ON s.id = r.sheet_id LEFT JOIN users u ON u.id = r.author_id WHERE ${where('r')}
		   UNION ALL
		   SELECT 'shared', a.sheet_id, s.name, u.name, a.detail, a.created_at
		     FROM audit_events a JOIN sheets s ON s.id = a.sheet_id LEFT JOIN users u ON u.id = a.actor_id WHERE a.type = 'sheet_shared' AND ${where('a')}
		   UNION ALL
		   SELECT x.kind, x.sheet_id, s.name, u.name, x.detail, x.created_at
		     FROM activity x LEFT JOIN sheets s ON s.id = x.sheet_id LEFT JOIN users u ON u.id = x.actor_id
		    WHERE ${bySheet ? 'x.sheet_id = :id' : 'x.workspace_id = :id'}
		 ) feed ORDER BY at DESC LIMIT :limit`,
		{ replacements: { id: bySheet ? scope.sheetId : scope.workspaceId, limit: Math.min(Math.max(1, limit), 200) } }
	);
	return rows as ActivityRecord[];
}
