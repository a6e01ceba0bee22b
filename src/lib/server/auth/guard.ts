// Who is asking: the first line of every page load, form action and API handler that needs a
// person. Layout guards alone are not enough (form actions do not run layout loads).
import { error, redirect } from '@sveltejs/kit';
import { signInPath } from './next';

export type SignedInUser = { id: string; email: string; name: string };

/** Page loads and form actions: signed-out visitors go to sign-in and come back afterwards. */
export function requireUser(locals: App.Locals, url?: URL): SignedInUser {
	if (!locals.user) redirect(303, signInPath(url));
	return locals.user;
}

/** +server.ts handlers: a session cookie or `Authorization: Bearer pw_…`, else 401 (JSON). */
export function requireApiUser(locals: App.Locals): SignedInUser {
	if (!locals.user) error(401, 'Sign in or send an API token');
	return locals.user;
}
