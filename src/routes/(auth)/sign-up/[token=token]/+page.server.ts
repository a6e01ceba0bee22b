// The link from the sign-up mail. Opening it only shows the page (mail scanners open links);
// the button makes the account, signs it in and goes on to where sign-up started.
import { redirect } from '@sveltejs/kit';
import { clientAddress } from '$lib/server/auth/client-address';
import { failForm } from '$lib/server/auth/forms';
import { safeNext } from '$lib/server/auth/next';
import { invalidateSession, setSessionCookie } from '$lib/server/auth/session';
import { confirmSignUp } from '$lib/server/auth/sign-in';
import { findSignUpRequest, SIGN_UP_LIFETIME_MINUTES } from '$lib/server/db/sign-ups';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ params }) => {
	const link = await findSignUpRequest(params.token);
	return {
		state: link.state,
		email: link.state === 'valid' ? link.request.email : null,
		name: link.state === 'valid' ? link.request.name : null,
		minutes: SIGN_UP_LIFETIME_MINUTES
	};
};

export const actions: Actions = {
	default: async (event) => {
		const { params, cookies, url, locals } = event;
		const outcome = await confirmSignUp(params.token, clientAddress(event));
		if (!outcome.ok) return failForm(410, { state: outcome.state });
		if (locals.session) await invalidateSession(locals.session.id);
		setSessionCookie(cookies, outcome.token, outcome.session.expiresAt, url);
		redirect(303, safeNext(outcome.next));
	}
};
