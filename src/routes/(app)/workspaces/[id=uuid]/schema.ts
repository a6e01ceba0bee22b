import { z } from 'zod';
import { sheetName } from '$lib/schemas/names';
import { LIST_REVIEW_FILTERS, SHEET_SORTS } from '$lib/schemas/sheet-list';

// `template` picks a starting network from $lib/editor/templates (unknown ids start empty).
export const createSheetSchema = z.object({ name: sheetName, template: z.string().max(40).optional() });
export const renameSheetSchema = z.object({ id: z.uuid('Choose a sheet'), name: sheetName });
export const sheetIdSchema = z.object({ id: z.uuid('Choose a sheet') });

// The list's state lives in the URL so it can be bookmarked; anything odd falls back quietly.
export const listParams = z.object({
	q: z.string().max(100).catch(''),
	sort: z.enum(SHEET_SORTS).catch('updated'),
	dir: z.enum(['asc', 'desc']).optional().catch(undefined),
	page: z.coerce.number().int().min(1).max(100_000).catch(1),
	state: z.enum(LIST_REVIEW_FILTERS).or(z.literal('')).catch('')
});
