import { z } from 'zod';
import { currentPasswordField, emailField } from '$lib/server/auth/fields';

export const signInSchema = z.object({ email: emailField, password: currentPasswordField });
