// Request shapes of the JSON API (docs/api.md). Field rules come from $lib/schemas/names so the
// pages and the API reject the same input with the same words.
import { z } from 'zod';
import { networkDocumentSchema } from '../../network/schema';
import { email, inviteRole, sheetName, sheetRole, workspaceName } from '../../schemas/names';
import { SHEET_SORTS } from '../db/sheets';
import { ApiProblem } from './respond';
import { LIST_REVIEW_FILTERS } from '../review/state';

export const createWorkspaceBody = z.object({ name: workspaceName });
export const updateWorkspaceBody = z
	.object({ name: workspaceName.optional(), defaultSheetRole: sheetRole.optional() })
	.refine((b) => b.name !== undefined || b.defaultSheetRole !== undefined, 'send name and/or defaultSheetRole');
export const inviteBody = z.object({ email, role: inviteRole });
export const memberRoleBody = z.object({ role: inviteRole });
export const transferBody = z.object({ userId: z.uuid('userId must be a member’s id') });

// Layout is the editor's business; the API only bounds its size (through the body limit).
const layout = z.unknown().optional();
export const createSheetBody = z.object({ name: sheetName, document: networkDocumentSchema.optional(), layout });
export const renameSheetBody = z.object({ name: sheetName });
export const duplicateSheetBody = z.object({ name: sheetName.optional() });
export const saveRevisionBody = z.object({
	baseRevision: z.number({ error: 'baseRevision (the revision your change started from) is required' }).int().min(1),
	document: networkDocumentSchema,
	layout,
	message: z.string().trim().max(200, 'message is too long (at most 200 characters)').optional()
});
export const restoreRevisionBody = z.object({ baseRevision: z.number().int().min(1).optional() });
/** Marking a checkpoint: an optional short name and message (as naming a revision in the history). */
export const checkpointBody = z.object({
	name: z.string().trim().max(80, 'name: at most 80 characters').optional(),
	message: z.string().trim().max(200, 'message: at most 200 characters').optional()
});
export const shareBody = z.object({ email, role: sheetRole });
export const grantRoleBody = z.object({ role: sheetRole });
export const linkBody = z.object({ label: z.string().trim().max(80, 'label is too long (at most 80 characters)').optional() });

export const sheetListQuery = z.object({
	q: z.string().max(100, 'q is too long (at most 100 characters)').optional(),
	sort: z.enum(SHEET_SORTS, { error: `sort must be one of ${SHEET_SORTS.join(', ')}` }).optional(),
	dir: z.enum(['asc', 'desc'], { error: 'dir must be asc or desc' }).optional(),
	page: z.coerce.number().int().min(1).max(100_000).optional(),
	perPage: z.coerce.number().int().min(1).max(100, 'perPage is at most 100').optional(),
	trashed: z.enum(['0', '1', 'true', 'false']).transform((v) => v === '1' || v === 'true').optional(),
	state: z.enum(LIST_REVIEW_FILTERS, { error: `state must be one of ${LIST_REVIEW_FILTERS.join(', ')}` }).optional()
});

/** Parse URL search parameters against a schema; 400 naming the parameter otherwise. */
export function readQuery<S extends z.ZodType>(url: URL, schema: S): z.output<S> {
	const parsed = schema.safeParse(Object.fromEntries(url.searchParams));
	if (!parsed.success) {
		const issue = parsed.error.issues[0];
		throw new ApiProblem(400, `${issue.path.join('.') || 'query'}: ${issue.message}`);
	}
	return parsed.data;
}
