// Attachment data verbs: files on a sheet or on one of its comments, stored as bytea with the
// content type decided from their bytes (src/lib/server/exchange/file-type.ts).
import { QueryTypes } from 'sequelize';
import { db } from './connection';

export interface AttachmentSummary {
	id: string;
	sheetId: string;
	commentId: string | null;
	fileName: string;
	contentType: string;
	byteSize: number;
	sha256: string;
	createdBy: string | null;
	createdByName: string | null;
	createdAt: Date;
}

const FIELDS = `a.id, a.sheet_id AS "sheetId", a.comment_id AS "commentId", a.file_name AS "fileName", a.content_type AS "contentType",
	a.byte_size AS "byteSize", a.sha256, a.created_by AS "createdBy", u.name AS "createdByName", a.created_at AS "createdAt"`;
const FROM = `FROM attachments a LEFT JOIN users u ON u.id = a.created_by`;

export async function createAttachment(input: {
	sheetId: string;
	commentId: string | null;
	userId: string;
	fileName: string;
	contentType: string;
	sha256: string;
	data: Buffer;
}): Promise<AttachmentSummary> {
	const [row] = await db().query<{ id: string }>(
		`INSERT INTO attachments (id, sheet_id, comment_id, file_name, content_type, byte_size, sha256, data, created_by, created_at)
		 VALUES (gen_random_uuid(), $1, $2, $3, $4, $5, $6, $7, $8, now()) RETURNING id`,
		{
			bind: [
				input.sheetId,
				input.commentId,
				input.fileName,
				input.contentType,
				input.data.length,
				input.sha256,
				input.data,
				input.userId
			],
			type: QueryTypes.SELECT
		}
	);
	return (await getAttachment(input.sheetId, row.id))!;
}

/** The sheet's own attachments, or one comment's with `commentId`; all of them with 'all'. */
export async function listAttachments(
	sheetId: string,
	commentId: string | null | 'all' = null
): Promise<AttachmentSummary[]> {
	const where =
		commentId === 'all'
			? ''
			: commentId === null
				? ' AND a.comment_id IS NULL'
				: ' AND a.comment_id = $2';
	return db().query<AttachmentSummary>(
		`SELECT ${FIELDS} ${FROM} WHERE a.sheet_id = $1${where} ORDER BY a.created_at, a.id`,
		{
			bind: commentId === 'all' || commentId === null ? [sheetId] : [sheetId, commentId],
			type: QueryTypes.SELECT
		}
	);
}

export async function getAttachment(
	sheetId: string,
	id: string
): Promise<AttachmentSummary | null> {
	const rows = await db().query<AttachmentSummary>(
		`SELECT ${FIELDS} ${FROM} WHERE a.sheet_id = $1 AND a.id = $2`,
		{ bind: [sheetId, id], type: QueryTypes.SELECT }
	);
	return rows[0] ?? null;
}

export async function attachmentData(
	sheetId: string,
	id: string
): Promise<(AttachmentSummary & { data: Buffer }) | null> {
	const rows = await db().query<AttachmentSummary & { data: Buffer }>(
		`SELECT ${FIELDS}, a.data ${FROM} WHERE a.sheet_id = $1 AND a.id = $2`,
		{
			bind: [sheetId, id],
			type: QueryTypes.SELECT
		}
	);
	return rows[0] ?? null;
}

export async function deleteAttachment(sheetId: string, id: string): Promise<boolean> {
	const rows = await db().query<{ id: string }>(
		`DELETE FROM attachments WHERE sheet_id = $1 AND id = $2 RETURNING id`,
		{ bind: [sheetId, id], type: QueryTypes.SELECT }
	);
	return rows.length > 0;
}

export async function countAttachments(sheetId: string): Promise<number> {
	const [row] = await db().query<{ n: number }>(
		`SELECT count(*)::int AS n FROM attachments WHERE sheet_id = $1`,
		{ bind: [sheetId], type: QueryTypes.SELECT }
	);
	return row.n;
}
