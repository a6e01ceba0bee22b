// The sheet data verbs. Routes import these, never the models. Every save is a new immutable
// revision; a save must name the revision it was based on, and loses (409) when another save
// got there first.
import { Op, UniqueConstraintError, type Transaction } from 'sequelize';
import { db } from './connection';
import { models } from './models';
import { SHEET_SORTS, type SheetSort } from '../../schemas/sheet-list';

export class RevisionConflict extends Error {
	constructor(readonly latest: RevisionRecord) {
		super(`sheet ${latest.sheetId} has revision ${latest.number}; the save was based on an older one`);
	}
}

export interface RevisionRecord {
	id: string;
	sheetId: string;
	number: number;
	authorId: string | null;
	document: unknown;
	layout: unknown;
	message: string | null;
	/** A person's label for the revision (null: none). */
	name?: string | null;
	createdAt: Date;
}

export interface SheetRecord {
	id: string;
	workspaceId: string;
	name: string;
	status: string;
	latestRevision: number;
	createdBy: string | null;
	updatedBy: string | null;
	trashedAt: Date | null;
	createdAt: Date;
	updatedAt: Date;
}

const plain = <T>(row: { get(options: { plain: true }): unknown }) => row.get({ plain: true }) as T;

export async function createSheet(input: {
	userId: string;
	workspaceId: string;
	name: string;
	document: unknown;
	layout?: unknown;
}): Promise<{ sheet: SheetRecord; revision: RevisionRecord }> {
	const { Sheet, SheetRevision } = models();
	return db().transaction(async (transaction) => {
		const sheet = await Sheet.create(
			{ workspaceId: input.workspaceId, name: input.name, createdBy: input.userId, updatedBy: input.userId, latestRevision: 1 },
			{ transaction }
		);
		const revision = await SheetRevision.create(
			{ sheetId: sheet.id, number: 1, authorId: input.userId, document: input.document, layout: input.layout ?? null, message: 'Created' },
			{ transaction }
		);
		return { sheet: plain<SheetRecord>(sheet), revision: plain<RevisionRecord>(revision) };
	});
}

export async function getSheet(id: string): Promise<SheetRecord | null> {
	const row = await models().Sheet.findByPk(id);
	return row ? plain<SheetRecord>(row) : null;
}

export async function listSheets(workspaceId: string, { trashed = false } = {}): Promise<SheetRecord[]> {
	const rows = await models().Sheet.findAll({
		where: { workspaceId, trashedAt: trashed ? { [Op.ne]: null } : null },
		order: [['updatedAt', 'DESC']]
	});
	return rows.map((r) => plain<SheetRecord>(r));
}

export async function getRevision(sheetId: string, number?: number, transaction?: Transaction): Promise<RevisionRecord | null> {
	const { SheetRevision } = models();
	const row = await SheetRevision.findOne({
		where: number === undefined ? { sheetId } : { sheetId, number },
		order: [['number', 'DESC']],
		transaction
	});
	return row ? plain<RevisionRecord>(row) : null;
}

export type RevisionSummary = Omit<RevisionRecord, 'document' | 'layout'> & { authorName: string | null };

/** The history, newest first, with each author's name (null once the account is gone). */
export async function listRevisions(sheetId: string): Promise<RevisionSummary[]> {
	const { SheetRevision, User } = models();
	const rows = await SheetRevision.findAll({
		where: { sheetId },
		attributes: ['id', 'sheetId', 'number', 'authorId', 'message', 'name', 'createdAt'],
		include: [{ model: User, as: 'author', attributes: ['name'] }],
		order: [['number', 'DESC']]
	});
	return rows.map((r) => {
		const { author, ...rest } = plain<Omit<RevisionRecord, 'document' | 'layout'> & { author: { name: string } | null }>(r);
		return { ...rest, authorName: author?.name ?? null };
	});
}

/** Name a revision (a checkpoint), and give it a message if it has none; null clears the name. */
export async function nameRevision(sheetId: string, number: number, name: string | null, message?: string | null): Promise<boolean> {
	const { SheetRevision } = models();
	const row = await SheetRevision.findOne({ where: { sheetId, number } });
	if (!row) return false;
	row.name = name;
	if (message && !row.message) row.message = message;
	await row.save({ fields: ['name', 'message'] });
	return true;
}

/**
 * Mark a revision as a checkpoint (a person's explicit save): it ends its group of saves. A name
 * or a message given with it is kept (an existing message is never overwritten).
 */
export async function markCheckpoint(sheetId: string, number: number, name: string | null, message: string | null): Promise<boolean> {
	const { SheetRevision } = models();
	const row = await SheetRevision.findOne({ where: { sheetId, number } });
	if (!row) return false;
	row.checkpoint = true;
	if (name) row.name = name;
	if (message && !row.message) row.message = message;
	await row.save({ fields: ['checkpoint', 'name', 'message'] });
	return true;
}

/** Every revision with its document, oldest first, for grouping the history into checkpoints. */
export async function revisionsForHistory(sheetId: string) {
	const [rows] = await db().query(
		`SELECT r.number, r.author_id AS "authorId", u.name AS "authorName", r.created_at AS "createdAt", r.message, r.name, r.checkpoint, r.document
		   FROM sheet_revisions r LEFT JOIN users u ON u.id = r.author_id WHERE r.sheet_id = :sheetId ORDER BY r.number`,
		{ replacements: { sheetId } }
	);
	return rows as { number: number; authorId: string | null; authorName: string | null; createdAt: Date; message: string | null; name: string | null; checkpoint: boolean; document: unknown }[];
}

/** Which revisions something points at: comments, review requests (and their sign-offs), meeting items. */
export async function revisionReferences(sheetId: string): Promise<Map<number, Set<'comment' | 'review' | 'meeting'>>> {
	const [rows] = (await db().query(
		`SELECT revision_number AS n, 'comment' AS kind FROM comments WHERE sheet_id = :sheetId
		 UNION SELECT revision_number, 'review' FROM review_requests WHERE sheet_id = :sheetId
		 UNION SELECT revision_number, 'meeting' FROM meeting_items WHERE sheet_id = :sheetId`,
		{ replacements: { sheetId } }
	)) as [{ n: number; kind: 'comment' | 'review' | 'meeting' }[], unknown];
	const out = new Map<number, Set<'comment' | 'review' | 'meeting'>>();
	for (const r of rows) (out.get(r.n) ?? out.set(r.n, new Set()).get(r.n)!).add(r.kind);
	return out;
}

/**
 * Save a new revision on top of `baseRevision`. Two saves on the same base race for the unique
 * (sheet, number) index inside their transactions; the loser gets a RevisionConflict carrying
 * the revision that won, so nothing is overwritten silently.
 */
export async function saveRevision(
	userId: string,
	sheetId: string,
	content: { document: unknown; layout?: unknown; message?: string | null },
	baseRevision: number
): Promise<RevisionRecord> {
	const { Sheet, SheetRevision } = models();
	try {
		return await db().transaction(async (transaction) => {
			const sheet = await Sheet.findByPk(sheetId, { transaction, lock: transaction.LOCK.UPDATE });
			if (!sheet) throw new Error(`sheet ${sheetId} does not exist`);
			if (sheet.latestRevision !== baseRevision) {
				throw new RevisionConflict((await getRevision(sheetId, sheet.latestRevision, transaction))!);
			}
			const revision = await SheetRevision.create(
				{ sheetId, number: baseRevision + 1, authorId: userId, document: content.document, layout: content.layout ?? null, message: content.message ?? null },
				{ transaction }
			);
			await sheet.update({ latestRevision: baseRevision + 1, updatedBy: userId }, { transaction });
			return plain<RevisionRecord>(revision);
		});
	} catch (error) {
		if (error instanceof UniqueConstraintError) {
			throw new RevisionConflict((await getRevision(sheetId))!);
		}
		throw error;
	}
}

export class SheetStateError extends Error {}

export async function renameSheet(userId: string, sheetId: string, name: string): Promise<SheetRecord> {
	const row = await models().Sheet.findByPk(sheetId, { rejectOnEmpty: true });
	await row.update({ name, updatedBy: userId });
	return plain<SheetRecord>(row);
}

/** A new sheet in the same workspace holding the newest revision's content as its revision 1. */
export async function duplicateSheet(userId: string, sheetId: string, name: string) {
	const source = await getSheet(sheetId);
	const latest = await getRevision(sheetId);
	if (!source || !latest) throw new SheetStateError('The sheet has no revision to copy.');
	return createSheet({ userId, workspaceId: source.workspaceId, name, document: latest.document, layout: latest.layout });
}

export async function trashSheet(userId: string, sheetId: string): Promise<SheetRecord> {
	const row = await models().Sheet.findByPk(sheetId, { rejectOnEmpty: true });
	if (!row.trashedAt) await row.update({ trashedAt: new Date(), updatedBy: userId });
	return plain<SheetRecord>(row);
}

export async function restoreSheet(userId: string, sheetId: string): Promise<SheetRecord> {
	const row = await models().Sheet.findByPk(sheetId, { rejectOnEmpty: true });
	if (row.trashedAt) await row.update({ trashedAt: null, updatedBy: userId });
	return plain<SheetRecord>(row);
}

/** Delete for good, with every revision, grant and link (foreign keys cascade). Trash first. */
export async function destroySheet(sheetId: string): Promise<void> {
	const row = await models().Sheet.findByPk(sheetId, { rejectOnEmpty: true });
	if (!row.trashedAt) throw new SheetStateError('Move the sheet to the trash before deleting it for good.');
	await row.destroy();
}

/**
 * Restore an old revision by saving its content as a new one on top of `baseRevision`, so the
 * history only grows and a concurrent save still gets its 409.
 */
export async function restoreRevision(userId: string, sheetId: string, number: number, baseRevision: number): Promise<RevisionRecord> {
	const old = await getRevision(sheetId, number);
	if (!old) throw new SheetStateError(`Revision ${number} does not exist.`);
	return saveRevision(userId, sheetId, { document: old.document, layout: old.layout, message: `Restored revision ${number}` }, baseRevision);
}

export { SHEET_SORTS, type SheetSort };

export interface SheetListQuery {
	workspaceId: string;
	q?: string;
	sort?: SheetSort;
	dir?: 'asc' | 'desc';
	page?: number;
	perPage?: number;
	trashed?: boolean;
	/** With a user, each row also carries that user's grant on it (for per-row permissions). */
	userId?: string;
	/** Every matching row in one page (for sorting or filtering by a figure SQL does not hold). */
	all?: boolean;
}

export interface SheetListRow extends SheetRecord {
	updatedByName: string | null;
	grantRole: 'editor' | 'commenter' | 'viewer' | null;
}

const SORT_SQL: Record<SheetSort, string> = {
	name: 'lower(s.name)',
	updated: 's.updated_at',
	status: 's.status',
	author: "lower(coalesce(u.name, ''))"
};

/** One page of a workspace's sheets, filtered by a text in the name, with the total count. */
export async function listSheetsPage(query: SheetListQuery): Promise<{ rows: SheetListRow[]; total: number; page: number; perPage: number }> {
	const perPage = Math.min(Math.max(query.perPage ?? 25, 1), 100);
	const page = Math.max(query.page ?? 1, 1);
	const sort = SORT_SQL[query.sort ?? 'updated'];
	const dir = (query.dir ?? (query.sort === 'name' || query.sort === 'author' ? 'asc' : 'desc')) === 'asc' ? 'ASC' : 'DESC';
	// The filter is a plain substring: escape LIKE's own wildcards so "50%" means 50%.
	const pattern = query.q?.trim() ? `%${query.q.trim().replace(/[\\%_]/g, (c) => `\\${c}`)}%` : null;
	const where = `s.workspace_id = :workspaceId AND s.trashed_at IS ${query.trashed ? 'NOT NULL' : 'NULL'}${pattern ? ' AND s.name ILIKE :pattern' : ''}`;
	const replacements = { workspaceId: query.workspaceId, pattern, userId: query.userId ?? null, limit: perPage, offset: (page - 1) * perPage };
	const [rows] = await db().query(
		`SELECT s.id, s.workspace_id AS "workspaceId", s.name, s.status, s.latest_revision AS "latestRevision",
		        s.created_by AS "createdBy", s.updated_by AS "updatedBy", s.trashed_at AS "trashedAt",
		        s.created_at AS "createdAt", s.updated_at AS "updatedAt", u.name AS "updatedByName", g.role AS "grantRole"
		   FROM sheets s LEFT JOIN users u ON u.id = s.updated_by
		   LEFT JOIN sheet_grants g ON g.sheet_id = s.id AND g.user_id = :userId
		  WHERE ${where} ORDER BY ${sort} ${dir}, s.id${query.all ? '' : ' LIMIT :limit OFFSET :offset'}`,
		{ replacements }
	);
	const [[count]] = (await db().query(`SELECT count(*)::int AS n FROM sheets s WHERE ${where}`, { replacements })) as [[{ n: number }], unknown];
	return { rows: rows as SheetListRow[], total: count.n, page, perPage };
}
