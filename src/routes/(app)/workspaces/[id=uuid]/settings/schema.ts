import { z } from 'zod';
import { email, inviteRole, sheetRole, workspaceName } from '$lib/schemas/names';

export const settingsSchema = z.object({ name: workspaceName, defaultSheetRole: sheetRole });
export const inviteSchema = z.object({ email, role: inviteRole });
export const memberRoleSchema = z.object({ userId: z.uuid('Choose a member'), role: inviteRole });
export const memberSchema = z.object({ userId: z.uuid('Choose a member') });
export const invitationSchema = z.object({ invitationId: z.uuid('Choose an invitation') });
export const leaveSchema = z.object({});
