// Request shapes of the review API (docs/api.md, "Review"). The messages name the field.
import { z } from 'zod';
import { anchorSchema } from './anchors';
import { BODY_LIMIT } from './markdown';
import { OUTCOMES } from '../db/models/meeting';

const body = z.string({ error: 'body is required' }).trim().min(1, 'body is empty: write something').max(BODY_LIMIT, `body is too long (at most ${BODY_LIMIT} characters)`);
const revision = z.number().int().min(1, 'revision must be a revision number').optional();
const isoDate = (field: string) =>
	z.string().regex(/^\d{4}-\d{2}-\d{2}$/, `${field} must be a date like 2026-12-24`).refine((d) => !Number.isNaN(Date.parse(d)), `${field} is not a real date`);
const title = z.string({ error: 'title is required' }).trim().min(1, 'title is empty').max(120, 'title is too long (at most 120 characters)');
const attendees = z.array(z.uuid('attendees must be member ids')).max(50, 'at most 50 attendees');

export const newCommentBody = z.object({ body, anchor: anchorSchema.optional(), revision, parentId: z.uuid('parentId must be a comment id').optional() });
export const changeCommentBody = z
	.object({ body: body.optional(), resolved: z.boolean({ error: 'resolved must be true or false' }).optional() })
	.refine((b) => b.body !== undefined || b.resolved !== undefined, 'send body and/or resolved');

export const reviewRequestBody = z.object({
	reviewers: z.array(z.string().trim().min(1).max(254), { error: 'reviewers must be a list of e-mail addresses or user ids' }).min(1, 'reviewers: name at least one person').max(20, 'at most 20 reviewers'),
	message: z.string().trim().max(2000, 'message is too long (at most 2000 characters)').default(''),
	dueOn: isoDate('dueOn').nullable().optional(),
	revision
});
// A sign-off is a reviewer's word that the revision is right: it says what was checked. An
// empty one (a stray click) is refused; asking for changes may say why in the comments instead.
export const reviewAnswerBody = z
	.object({
		decision: z.enum(['approve', 'changes'], { error: 'decision must be approve or changes' }),
		summary: z.string().trim().max(2000, 'summary is too long (at most 2000 characters)').default('')
	})
	.refine((b) => b.decision !== 'approve' || b.summary.length > 0, {
		path: ['summary'],
		message: 'say in a line what you checked before signing off'
	});

export const compareQuery = z.object({
	from: z.coerce.number({ error: 'from must be a revision number' }).int().min(1, 'from must be a revision number'),
	to: z.coerce.number({ error: 'to must be a revision number' }).int().min(1, 'to must be a revision number')
});

export const newMeetingBody = z.object({ workspaceId: z.uuid('workspaceId must be a workspace id'), title, heldOn: isoDate('heldOn'), attendees: attendees.default([]) });
export const changeMeetingBody = z.object({ title: title.optional(), heldOn: isoDate('heldOn').optional(), attendees: attendees.optional() });
export const meetingItemBody = z.object({ sheetId: z.uuid('sheetId must be a sheet id'), revision });
export const meetingOutcomeBody = z.object({
	outcome: z.enum(OUTCOMES, { error: `outcome must be one of ${OUTCOMES.join(', ')} or null` }).nullable().optional(),
	notes: z.string().max(4000, 'notes are too long (at most 4000 characters)').optional()
});
export const markReadBody = z.object({ ids: z.array(z.uuid()).max(200).optional() });
