// Attachments on a sheet (people who may save it) or on a comment (people who may comment),
// behind the access module. The type comes from the bytes; a file whose bytes are none of the
// allowed types, or whose name claims another type, is refused with 415 and nothing is stored.
import { createHash } from 'node:crypto';
import { authorizeSheet, type Actor } from '../access';
import { ApiProblem } from '../api/respond';
import * as store from '../db/attachments';
import { getComment } from '../db/comments';
import { requireId } from '../api/ids';
import { ALLOWED_TYPES, extensionFits, sniffType } from './file-type';
import { PER_SHEET } from './limits';
import type { Upload } from './upload';

const ALLOWED_TEXT = 'PNG, JPEG, GIF, WebP images and PDF documents';

export async function listAttachmentsAs(
	actor: Actor,
	sheetId: string,
	commentId: string | null | 'all' = null
) {
	await authorizeSheet(actor, sheetId, 'read');
	return store.listAttachments(sheetId, commentId);
}

export async function attachmentFileAs(actor: Actor, sheetId: string, id: string) {
	await authorizeSheet(actor, sheetId, 'read');
	const a = await store.attachmentData(sheetId, id);
	if (!a) throw new ApiProblem(404, 'Not found.');
	return a;
}

export async function uploadAttachmentAs(
	actor: Actor & { kind: 'user' },
	sheetId: string,
	upload: Upload
) {
	const commentId = upload.fields.commentId ? requireId(upload.fields.commentId, 'commentId', 'body') : null;
	await authorizeSheet(actor, sheetId, commentId ? 'comment' : 'save');
	if (commentId) {
		const comment = await getComment(sheetId, commentId);
		if (!comment || comment.deletedAt)
			throw new ApiProblem(404, 'commentId: no such comment on this sheet.');
	}
	if (upload.bytes.length === 0) throw new ApiProblem(400, 'file: the file is empty.');
	const type = sniffType(upload.bytes);
	if (!type)
		throw new ApiProblem(
			415,
			`Only ${ALLOWED_TEXT} can be attached; the file's content is none of them.`,
			{ code: 'unsupported_type', allowed: ALLOWED_TYPES }
		);
	if (!extensionFits(upload.fileName, type)) {
		throw new ApiProblem(
			415,
			`The file is named "${upload.fileName}" but its content is ${type}; rename it or attach the real file.`,
			{ code: 'disguised_type' }
		);
	}
	if ((await store.countAttachments(sheetId)) >= PER_SHEET.attachments)
		throw new ApiProblem(
			409,
			`A sheet holds at most ${PER_SHEET.attachments} attachments; delete one first.`
		);
	const sha256 = createHash('sha256').update(upload.bytes).digest('hex');
	const fileName =
		upload.fileName === 'file' ? `attachment.${type.split('/')[1]}` : upload.fileName;
	return store.createAttachment({
		sheetId,
		commentId,
		userId: actor.id,
		fileName,
		contentType: type,
		sha256,
		data: upload.bytes
	});
}

export async function deleteAttachmentAs(actor: Actor, sheetId: string, id: string) {
	const access = await authorizeSheet(actor, sheetId, 'read');
	const a = await store.getAttachment(sheetId, id);
	if (!a) throw new ApiProblem(404, 'Not found.');
	// A comment's file goes with the same right that added it; a sheet's needs the right to save.
	await authorizeSheet(actor, access.sheet.id, a.commentId ? 'comment' : 'save');
	await store.deleteAttachment(sheetId, id);
}
