import { z } from 'zod';
import { currentPasswordField, nameField, newPasswordField, PASSWORD_IS_EMAIL, sameAsEmail } from '$lib/server/auth/fields';

export const renameSchema = z.object({ name: nameField });

export const passwordSchema = (email: string) =>
	z
		.object({ current: currentPasswordField, password: newPasswordField, confirm: z.string().max(256) })
		.refine((v) => !sameAsEmail(v.password, email), { message: PASSWORD_IS_EMAIL, path: ['password'] })
		.refine((v) => v.password === v.confirm, { message: 'The two new passwords are not the same.', path: ['confirm'] });

export const tokenNameSchema = z.object({
	tokenName: z
		.string()
		.trim()
		.min(1, 'Name the token after the script or machine that will use it.')
		.max(60, 'A token name has at most 60 characters.')
		// eslint-disable-next-line no-control-regex -- matching control characters is the point
		.refine((s) => !/[<>\u0000-\u001f]/.test(s), 'A token name cannot contain <, > or control characters.')
});

export const revokeSchema = z.object({ id: z.uuid('That token is not one of yours.') });
