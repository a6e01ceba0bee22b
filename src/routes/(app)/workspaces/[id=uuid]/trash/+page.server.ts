import { clientAddress } from '$lib/server/auth/client-address';
import { formAction, formActor } from '$lib/server/sharing/form-action';
import { sheetTable } from '$lib/server/sharing/sheet-list';
import { destroySheetAs, restoreSheetAs } from '$lib/server/sharing/sheet-actions';
import { listParams, sheetIdSchema } from '../schema';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const { workspace, role } = await event.parent();
	const params = listParams.parse(Object.fromEntries(event.url.searchParams));
	return sheetTable(formActor(event), workspace, role, params, { trashed: true, actions: ['restore', 'delete'] });
};

export const actions: Actions = {
	restore: (event) =>
		formAction(event, 'restore', sheetIdSchema, async ({ id }, actor) => {
			const sheet = await restoreSheetAs(actor, id);
			return { message: `“${sheet.name}” is back in the sheet list.`, sheetId: id };
		}),
	destroy: (event) =>
		formAction(event, 'destroy', sheetIdSchema, async ({ id }, actor) => {
			const sheet = await destroySheetAs(actor, id, { ip: clientAddress(event) });
			return { message: `“${sheet.name}” and all its revisions are deleted for good.`, sheetId: id };
		})
};
