// Comment data verbs. A thread is a first comment and its replies (one level). A deleted comment
// keeps its row with an empty body so the replies under it still read in order.
import { db } from './connection';
import { reviewModels } from './models/review';
import type { AnchorKind } from './models/comment';
import type { Mentionable } from '../review/mentions';

export interface CommentRecord {
	id: string;
	sheetId: string;
	parentId: string | null;
	authorId: string | null;
	authorName: string | null;
	revisionNumber: number;
	anchorKind: AnchorKind;
	anchorRef: string | null;
	anchorSnapshot: unknown;
	body: string;
	bodyHtml: string;
	mentions: string[];
	resolvedAt: Date | null;
	resolvedBy: string | null;
	editedAt: Date | null;
	deletedAt: Date | null;
	createdAt: Date;
}

const SELECT = `SELECT c.id, c.sheet_id AS "sheetId", c.parent_id AS "parentId", c.author_id AS "authorId", u.name AS "authorName",
	c.revision_number AS "revisionNumber", c.anchor_kind AS "anchorKind", c.anchor_ref AS "anchorRef", c.anchor_snapshot AS "anchorSnapshot",
	c.body, c.body_html AS "bodyHtml", c.mentions, c.resolved_at AS "resolvedAt", c.resolved_by AS "resolvedBy",
	c.edited_at AS "editedAt", c.deleted_at AS "deletedAt", c.created_at AS "createdAt"
	FROM comments c LEFT JOIN users u ON u.id = c.author_id`;

export type NewComment = Omit<CommentRecord, 'id' | 'authorId' | 'authorName' | 'resolvedAt' | 'resolvedBy' | 'editedAt' | 'deletedAt' | 'createdAt'> & { authorId: string };

export async function insertComment(input: NewComment): Promise<CommentRecord> {
	const row = await reviewModels().Comment.create({ ...input, resolvedAt: null, resolvedBy: null, editedAt: null, deletedAt: null });
	return (await getComment(input.sheetId, row.id))!;
}

export async function getComment(sheetId: string, id: string): Promise<CommentRecord | null> {
	const [rows] = await db().query(`${SELECT} WHERE c.id = :id AND c.sheet_id = :sheetId`, { replacements: { id, sheetId } });
	return (rows[0] as CommentRecord) ?? null;
}

/** Every comment of a sheet, oldest first (threads are assembled by the caller). */
export async function listComments(sheetId: string): Promise<CommentRecord[]> {
	const [rows] = await db().query(`${SELECT} WHERE c.sheet_id = :sheetId ORDER BY c.created_at, c.id`, { replacements: { sheetId } });
	return rows as CommentRecord[];
}

export async function editComment(id: string, changes: { body: string; bodyHtml: string; mentions: string[] }): Promise<void> {
	await reviewModels().Comment.update({ ...changes, editedAt: new Date() }, { where: { id } });
}

export async function setResolved(id: string, userId: string | null): Promise<void> {
	await reviewModels().Comment.update({ resolvedAt: userId ? new Date() : null, resolvedBy: userId }, { where: { id } });
}

export async function markDeleted(id: string): Promise<void> {
	await reviewModels().Comment.update({ body: '', bodyHtml: '', mentions: [], deletedAt: new Date() }, { where: { id } });
}

/** Everyone who can open the sheet by name: the workspace's members and the sheet's guests. */
export async function listAudience(sheetId: string): Promise<Mentionable[]> {
	const [rows] = await db().query(
		`SELECT u.id, u.name, u.email FROM sheets s JOIN memberships m ON m.workspace_id = s.workspace_id JOIN users u ON u.id = m.user_id WHERE s.id = :sheetId
		 UNION
		 SELECT u.id, u.name, u.email FROM sheet_grants g JOIN users u ON u.id = g.user_id WHERE g.sheet_id = :sheetId
		 ORDER BY 2, 3`,
		{ replacements: { sheetId } }
	);
	return rows as Mentionable[];
}
