// Field rules shared by the forms and the JSON API, so both say the same thing about bad input.
// Names are stored as typed and always rendered as text, so markup in a name stays inert.
import { z } from 'zod';

// eslint-disable-next-line no-control-regex -- matching control characters is the point
const CONTROL = /[\u0000-\u001f\u007f]/;

const name = (field: string, max: number) =>
	z
		.string({ error: `${field} is required` })
		.trim()
		.min(1, `${field} is required`)
		.max(max, `${field} is too long (at most ${max} characters)`)
		.refine((s) => !CONTROL.test(s), `${field} may not contain control characters or line breaks`);

export const sheetName = name('Sheet name', 120);
export const workspaceName = name('Workspace name', 100);
export const email = z
	.string({ error: 'E-mail address is required' })
	.trim()
	.toLowerCase()
	.max(254, 'E-mail address is too long (at most 254 characters)')
	.pipe(z.email('Enter a valid e-mail address, like name@example.com'));

export const WORKSPACE_ROLES = ['owner', 'admin', 'member'] as const;
export const INVITE_ROLES = ['admin', 'member'] as const;
export const SHEET_ROLES = ['editor', 'commenter', 'viewer'] as const;

export const sheetRole = z.enum(SHEET_ROLES, { error: 'Role must be editor, commenter or viewer' });
export const inviteRole = z.enum(INVITE_ROLES, { error: 'Role must be admin or member' });
