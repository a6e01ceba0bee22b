// The fields every identity form shares, with the messages shown beside them. Each route's
// schema.ts composes these.
import { z } from 'zod';

export const PASSWORD_MIN = 10;
export const PASSWORD_MAX = 256;
export const NAME_MAX = 100;
export const EMAIL_MAX = 254; // RFC 5321's limit on a forward path

export const emailField = z
	.string()
	.trim()
	.min(1, 'Enter your e-mail address.')
	.max(EMAIL_MAX, `An e-mail address has at most ${EMAIL_MAX} characters.`)
	.pipe(z.email('Enter an e-mail address like name@example.com.'))
	.transform((s) => s.toLowerCase());

export const nameField = z
	.string()
	.trim()
	.min(1, 'Enter your name.')
	.max(NAME_MAX, `A name has at most ${NAME_MAX} characters.`)
	// Names are always shown escaped; angle brackets are refused anyway so nobody is surprised
	// by markup appearing as text in a colleague's member list or an e-mail.
	.refine((s) => !/[<>]/.test(s), 'A name cannot contain < or >.')
	// eslint-disable-next-line no-control-regex -- matching control characters is the point
	.refine((s) => !/[\u0000-\u001f\u007f]/.test(s), 'A name cannot contain control characters.');

export const newPasswordField = z
	.string()
	.min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters.`)
	.max(PASSWORD_MAX, `Use at most ${PASSWORD_MAX} characters.`);

/** Sign-in takes whatever was typed (within bounds): the policy applies when a password is set. */
export const currentPasswordField = z.string().min(1, 'Enter your password.').max(PASSWORD_MAX, `A password has at most ${PASSWORD_MAX} characters.`);

export const PASSWORD_IS_EMAIL = 'Choose a password that is not your e-mail address.';
export const sameAsEmail = (password: string, email: string) => password.trim().toLowerCase() === email.trim().toLowerCase();
