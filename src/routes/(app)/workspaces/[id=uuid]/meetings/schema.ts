// The meeting forms. Dates come from <input type="date"> (YYYY-MM-DD).
import { z } from 'zod';
import { OUTCOMES } from '$lib/server/db/models/meeting';

const title = z.string().trim().min(1, 'Give the meeting a name.').max(120, 'At most 120 characters.');
const date = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Pick a date.');
const attendees = z.array(z.uuid('Pick attendees from the list.')).max(50, 'At most 50 attendees.');

export const meetingSchema = z.object({ title, heldOn: date, attendees });
export const itemSchema = z.object({ sheetId: z.uuid('Pick a sheet.'), revision: z.coerce.number().int().min(1, 'Pick a revision.').optional() });
export const outcomeSchema = z.object({
	itemId: z.uuid(),
	outcome: z.union([z.enum(OUTCOMES), z.literal('')]).transform((v) => (v === '' ? null : v)),
	notes: z.string().max(4000, 'Notes are at most 4000 characters.')
});
export const itemIdSchema = z.object({ itemId: z.uuid() });
export const emptySchema = z.object({});
