import { z } from 'zod';
import { email, sheetName, sheetRole } from '$lib/schemas/names';

export const renameSchema = z.object({ name: sheetName });
export const restoreSchema = z.object({ number: z.coerce.number().int().min(1, 'Choose a revision') });
export const shareSchema = z.object({ email, role: sheetRole });
export const grantSchema = z.object({ userId: z.uuid('Choose a person'), role: sheetRole });
export const personSchema = z.object({ userId: z.uuid('Choose a person') });
export const linkSchema = z.object({ label: z.string().trim().max(80, 'Label is too long (at most 80 characters)').optional() });
export const linkIdSchema = z.object({ linkId: z.uuid('Choose a link') });
export const invitationIdSchema = z.object({ invitationId: z.uuid('Choose an invitation') });
export const emptySchema = z.object({});
// Naming a revision (a checkpoint): a short name, an optional message; an empty name clears it.
export const nameRevisionSchema = z.object({
	number: z.coerce.number().int().min(1, 'Choose a revision'),
	name: z.string().trim().max(80, 'A name has at most 80 characters').default(''),
	message: z.string().trim().max(200, 'A message has at most 200 characters').default('')
});
