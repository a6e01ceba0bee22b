import type { LayoutServerLoad } from './$types';

// Only the fields pages need reach the browser.
export const load: LayoutServerLoad = ({ locals }) => ({
	user: locals.user ? { id: locals.user.id, email: locals.user.email, name: locals.user.name } : null
});
