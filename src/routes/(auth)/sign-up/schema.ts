import { z } from 'zod';
import { emailField, nameField, newPasswordField, PASSWORD_IS_EMAIL, sameAsEmail } from '$lib/server/auth/fields';

export const signUpSchema = z
	.object({ name: nameField, email: emailField, password: newPasswordField })
	.refine((v) => !sameAsEmail(v.password, v.email), { message: PASSWORD_IS_EMAIL, path: ['password'] });
