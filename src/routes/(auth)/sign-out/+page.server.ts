import { redirect } from '@sveltejs/kit';
import { clientAddress } from '$lib/server/auth/client-address';
import { clearSessionCookie } from '$lib/server/auth/session';
import { signOut } from '$lib/server/auth/sign-in';
import type { Actions, PageServerLoad } from './$types';

// Signing out is a POST (the header's form); this page only catches a typed or followed link.
export const load: PageServerLoad = ({ locals }) => {
	if (!locals.user) redirect(303, '/sign-in');
	return {};
};

export const actions: Actions = {
	default: async (event) => {
		const { locals, cookies, url } = event;
		if (locals.user && locals.session) await signOut(locals.user.id, locals.session.id, clientAddress(event));
		clearSessionCookie(cookies, url);
		redirect(303, '/');
	}
};
