import { z } from 'zod';
import { newPasswordField } from '$lib/server/auth/fields';

export const resetSchema = z
	.object({ password: newPasswordField, confirm: z.string().max(256) })
	.refine((v) => v.password === v.confirm, { message: 'The two passwords are not the same.', path: ['confirm'] });
