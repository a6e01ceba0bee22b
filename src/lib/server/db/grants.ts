// Per-sheet grants: a member raised above the workspace default, or a guest who sees this sheet
// only. A grant to a member below the default changes nothing (the stronger role wins).
import { db } from './connection';
import { sharingModels } from './models/sharing';
import type { SheetRole } from './models/workspace';

export interface GrantRecord {
	userId: string;
	name: string;
	email: string;
	role: SheetRole;
	/** False for a guest: someone outside the workspace who was given this sheet only. */
	member: boolean;
	grantedAt: Date;
}

export async function getGrant(sheetId: string, userId: string): Promise<{ role: SheetRole } | null> {
	const row = await sharingModels().SheetGrant.findOne({ where: { sheetId, userId }, attributes: ['role'] });
	return row ? { role: row.role } : null;
}

export async function listGrants(sheetId: string): Promise<GrantRecord[]> {
	const [rows] = await db().query(
		`SELECT g.user_id AS "userId", u.name, u.email, g.role, (m.id IS NOT NULL) AS member, g.created_at AS "grantedAt"
		   FROM sheet_grants g
		   JOIN users u ON u.id = g.user_id
		   JOIN sheets s ON s.id = g.sheet_id
		   LEFT JOIN memberships m ON m.workspace_id = s.workspace_id AND m.user_id = g.user_id
		  WHERE g.sheet_id = :sheetId
		  ORDER BY lower(u.name), u.email`,
		{ replacements: { sheetId } }
	);
	return rows as GrantRecord[];
}

/** Create or change a grant; returns whether it is new (a new grant sends a notice). */
export async function setGrant(sheetId: string, userId: string, role: SheetRole, grantedBy: string): Promise<{ created: boolean }> {
	const { SheetGrant } = sharingModels();
	const [row, created] = await SheetGrant.findOrCreate({ where: { sheetId, userId }, defaults: { sheetId, userId, role, grantedBy } });
	if (!created && row.role !== role) await row.update({ role, grantedBy });
	return { created };
}

export async function removeGrant(sheetId: string, userId: string): Promise<boolean> {
	return (await sharingModels().SheetGrant.destroy({ where: { sheetId, userId } })) > 0;
}

/** Sheets given to a user one by one in workspaces they are not a member of (guest access). */
export async function listGuestSheets(userId: string) {
	const [rows] = await db().query(
		`SELECT s.id, s.name, s.status, s.updated_at AS "updatedAt", g.role, w.name AS "workspaceName"
		   FROM sheet_grants g
		   JOIN sheets s ON s.id = g.sheet_id AND s.trashed_at IS NULL
		   JOIN workspaces w ON w.id = s.workspace_id
		  WHERE g.user_id = :userId
		    AND NOT EXISTS (SELECT 1 FROM memberships m WHERE m.workspace_id = s.workspace_id AND m.user_id = :userId)
		  ORDER BY s.updated_at DESC`,
		{ replacements: { userId } }
	);
	return rows as { id: string; name: string; status: string; updatedAt: Date; role: SheetRole; workspaceName: string }[];
}
