// The workspace page's "import a sheet file" form action. It reads and checks the file exactly as
// POST /api/sheets/import does (size limit, text, the sheet-file envelope, the analyzer's own
// validation, the right to create a sheet in the workspace) and turns a refusal into
// `fail(status, { section: 'import', … })` beside the form. The sheet is created only after
// every check has passed, so a refused file leaves nothing behind.
import { error, redirect, type RequestEvent } from '@sveltejs/kit';
import { AccessDenied } from '../access';
import { ApiProblem } from '../api/respond';
import { failForm } from '../auth/forms';
import { formActor } from '../sharing/form-action';
import { importSheetAs, parseSheetFile } from './transfer-actions';
import { readUpload } from './upload';
import { SHEET_FILE_MAX_BYTES } from '../../exchange';

const SECTION = 'import';

export async function importSheetForm(event: RequestEvent, workspaceId: string) {
	const actor = formActor(event);
	let name = '';
	let sheetId: string;
	try {
		const upload = await readUpload(event.request, event.url, SHEET_FILE_MAX_BYTES);
		name = (upload.fields.name ?? '').slice(0, 300);
		if (upload.bytes.length === 0) throw new ApiProblem(400, 'file: choose a file to upload.');
		const content = await parseSheetFile(upload.bytes, upload.fileName);
		sheetId = (await importSheetAs(actor, workspaceId, content, name)).sheet.id;
	} catch (e) {
		if (e instanceof AccessDenied) {
			if (e.status === 404 || e.status === 401) error(e.status, e.message);
			return failForm(e.status, { ok: false, section: SECTION, message: e.message });
		}
		if (!(e instanceof ApiProblem)) throw e;
		// "name: …" belongs beside the name field; everything else is about the file.
		const field = e.message.startsWith('name: ') ? 'name' : 'file';
		const text = e.message.replace(/^(name|file): /, '');
		const message =
			field === 'name'
				? text
				: text.startsWith('choose a file')
					? 'Choose a sheet file (.json) to import.'
					: `The file was not imported: ${text.replace(/^The /, 'the ').replace(/\.$/, '')}.`;
		return failForm(e.status, {
			ok: false,
			section: SECTION,
			message,
			values: { name },
			errors: { [field]: message }
		});
	}
	redirect(303, `/sheets/${sheetId}`);
}
