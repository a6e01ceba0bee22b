// The sheet table and the trash share one load: a page of rows with each row's permissions
// decided by access.ts, so a button is shown only where the action would be allowed.
import { can, type Actor, type Action, type WorkspaceRole } from '../access';
import { listSheetsPage } from '../db/sheets';
import type { WorkspaceRecord } from '../db/workspaces';
import { PER_PAGE, type SheetSort } from '../../schemas/sheet-list';

export async function sheetTable<A extends Action>(
	actor: Actor & { kind: 'user' },
	workspace: WorkspaceRecord,
	role: WorkspaceRole,
	params: { q: string; sort: SheetSort; dir?: 'asc' | 'desc'; page: number },
	{ trashed, actions }: { trashed: boolean; actions: A[] }
) {
	const result = await listSheetsPage({ workspaceId: workspace.id, ...params, trashed, perPage: PER_PAGE, userId: actor.id });
	const rows = result.rows.map((row) => {
		const target = { kind: 'sheet' as const, sheetId: row.id, workspaceRole: role, defaultSheetRole: workspace.defaultSheetRole, grantRole: row.grantRole, trashed };
		const may = Object.fromEntries(actions.map((a) => [a, can(actor, a, target)])) as Record<A, boolean>;
		return { ...row, may };
	});
	return { rows, total: result.total, page: result.page, perPage: result.perPage, params };
}
