import { z } from 'zod';
import { emailField } from '$lib/server/auth/fields';

export const forgotSchema = z.object({ email: emailField });
