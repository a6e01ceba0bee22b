import { redirect } from '@sveltejs/kit';
import { formAction, formActor } from '$lib/server/sharing/form-action';
import { sheetTable } from '$lib/server/sharing/sheet-list';
import { duplicateSheetAs, newSheet, renameSheetAs, trashSheetAs } from '$lib/server/sharing/sheet-actions';
import { templateById } from '$lib/editor/templates';
import { importSheetForm } from '$lib/server/exchange/import-form';
import { createSheetSchema, listParams, renameSheetSchema, sheetIdSchema } from './schema';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const { workspace, role } = await event.parent();
	const params = listParams.parse(Object.fromEntries(event.url.searchParams));
	return sheetTable(formActor(event), workspace, role, params, { trashed: false, actions: ['rename', 'duplicate', 'trash'] });
};

export const actions: Actions = {
	create: (event) =>
		formAction(event, 'create', createSheetSchema, async ({ name, template }, actor) => {
			const { sheet } = await newSheet(actor, event.params.id, { name, document: templateById(template)?.document });
			redirect(303, `/sheets/${sheet.id}`);
		}),
	// A sheet file (or a bare network document) as a new sheet; multipart, so not formAction.
	import: (event) => importSheetForm(event, event.params.id),
	rename: (event) =>
		formAction(event, 'rename', renameSheetSchema, async ({ id, name }, actor) => {
			await renameSheetAs(actor, id, name);
			return { message: `Renamed to “${name}”.`, sheetId: id };
		}),
	duplicate: (event) =>
		formAction(event, 'duplicate', sheetIdSchema, async ({ id }, actor) => {
			const { sheet } = await duplicateSheetAs(actor, id);
			return { message: `Made “${sheet.name}”.`, sheetId: sheet.id };
		}),
	trash: (event) =>
		formAction(event, 'trash', sheetIdSchema, async ({ id }, actor) => {
			const sheet = await trashSheetAs(actor, id);
			return { message: `“${sheet.name}” moved to the trash.`, sheetId: id };
		})
};
