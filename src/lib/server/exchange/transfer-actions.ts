// Sheet files out and in. Export writes the revision's network and canvas layout in the sheet
// file format (src/lib/exchange/sheet-file.ts); import checks the file with the analyzer's own
// validation and creates a new sheet in a workspace the caller may create sheets in.
import { authorizeWorkspace, type Actor } from '../access';
import { ApiProblem } from '../api/respond';
import { createSheet } from '../db/sheets';
import { gunzipCapped, isGzip } from './gunzip';
import {
	LARGE_SHEET_FILE_MAX_BYTES,
	readSheetFile,
	SheetFileError,
	writeSheetFile,
	type SheetFileContent
} from '../../exchange';
import { sheetName } from '../../schemas/names';
import { revisionFromQuery } from './stored-results';
import { uploadedText } from './text-file';

export async function exportSheetAs(actor: Actor, sheetId: string, url: URL) {
	const { sheet, revision } = await revisionFromQuery(actor, sheetId, url);
	return {
		sheet,
		revision,
		text: writeSheetFile({
			name: sheet.name,
			document: revision.document,
			layout: revision.layout ?? null
		})
	};
}

/** A sheet file as uploaded: JSON text, or gzip-compressed JSON for large networks. */
export async function parseSheetFile(bytes: Buffer, fileName: string): Promise<SheetFileContent> {
	const compressed = isGzip(bytes);
	const text = uploadedText(
		compressed ? await gunzipCapped(bytes, LARGE_SHEET_FILE_MAX_BYTES) : bytes,
		'a sheet file (JSON text)'
	);
	try {
		return readSheetFile(
			text,
			fileName.replace(/(\.json)?\.gz$/i, '').replace(/\.[^.]+$/, '') || 'Imported sheet',
			compressed ? LARGE_SHEET_FILE_MAX_BYTES : undefined
		);
	} catch (e) {
		if (e instanceof SheetFileError)
			throw new ApiProblem(422, e.message, {
				code: 'bad_sheet_file',
				...e.details,
				error: e.message
			});
		throw e;
	}
}

export async function importSheetAs(
	actor: Actor & { kind: 'user' },
	workspaceId: string,
	content: SheetFileContent,
	name?: string
) {
	await authorizeWorkspace(actor, workspaceId, 'create_sheet');
	const checked = sheetName.safeParse(name?.trim() ? name : content.name);
	if (!checked.success) throw new ApiProblem(400, `name: ${checked.error.issues[0].message}`);
	return createSheet({
		userId: actor.id,
		workspaceId,
		name: checked.data,
		document: content.document,
		layout: content.layout ?? undefined
	});
}
