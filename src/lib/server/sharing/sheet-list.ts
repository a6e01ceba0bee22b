// The sheet table and the trash share one load: a page of rows with each row's permissions
// decided by access.ts, so a button is shown only where the action would be allowed, and each
// row's review state in the sheet page's words (sortable and filterable).
import { can, type Actor, type Action, type WorkspaceRole } from '../access';
import { listSheetsPage, type SheetListQuery, type SheetListRow } from '../db/sheets';
import type { WorkspaceRecord } from '../db/workspaces';
import { reviewStates } from '../review/sheet-states';
import { filterOf, stateRank, type ListReviewFilter, type ListReviewState } from '../review/state';
import { PER_PAGE, type SheetSort } from '../../schemas/sheet-list';

export type SheetRowWithReview = SheetListRow & { review: ListReviewState };

/**
 * One page of sheets with their review states. Sorting or filtering by the review state needs
 * every matching sheet's state (it is worked out from requests, answers and revisions, not held
 * in a column), so those pages are cut after sorting; other sorts page in SQL.
 */
export async function sheetsWithReview(
	query: SheetListQuery & { state?: ListReviewFilter | '' }
): Promise<{ rows: SheetRowWithReview[]; total: number; page: number; perPage: number }> {
	const byReview = query.sort === 'status' || !!query.state;
	const result = await listSheetsPage({ ...query, all: byReview });
	const states = await reviewStates(result.rows);
	let rows = result.rows.map((r) => ({ ...r, review: states.get(r.id)! }));
	if (!byReview) return { ...result, rows };
	if (query.state) rows = rows.filter((r) => filterOf(r.review) === query.state);
	if (query.sort === 'status') {
		const sign = query.dir === 'desc' ? -1 : 1;
		rows.sort(
			(a, b) =>
				sign * (stateRank(a.review) - stateRank(b.review)) ||
				new Date(b.updatedAt).getTime() - new Date(a.updatedAt).getTime() ||
				(a.id < b.id ? -1 : 1)
		);
	}
	const perPage = result.perPage;
	const page = Math.min(result.page, Math.max(1, Math.ceil(rows.length / perPage)));
	return { rows: rows.slice((page - 1) * perPage, page * perPage), total: rows.length, page, perPage };
}

export async function sheetTable<A extends Action>(
	actor: Actor & { kind: 'user' },
	workspace: WorkspaceRecord,
	role: WorkspaceRole,
	params: { q: string; sort: SheetSort; dir?: 'asc' | 'desc'; page: number; state?: ListReviewFilter | '' },
	{ trashed, actions }: { trashed: boolean; actions: A[] }
) {
	const result = await sheetsWithReview({ workspaceId: workspace.id, ...params, trashed, perPage: PER_PAGE, userId: actor.id });
	const rows = result.rows.map((row) => {
		const target = { kind: 'sheet' as const, sheetId: row.id, workspaceRole: role, defaultSheetRole: workspace.defaultSheetRole, grantRole: row.grantRole, trashed };
		const may = Object.fromEntries(actions.map((a) => [a, can(actor, a, target)])) as Record<A, boolean>;
		return { ...row, may };
	});
	return { rows, total: result.total, page: result.page, perPage: result.perPage, params };
}
