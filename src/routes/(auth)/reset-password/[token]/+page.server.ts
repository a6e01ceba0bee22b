import { redirect } from '@sveltejs/kit';
import { clientAddress } from '$lib/server/auth/client-address';
import { PASSWORD_IS_EMAIL, sameAsEmail } from '$lib/server/auth/fields';
import { failForm, readForm } from '$lib/server/auth/forms';
import { resetEmailFor, resetPassword } from '$lib/server/auth/passwords';
import { clearSessionCookie } from '$lib/server/auth/session';
import { RESET_LIFETIME_MINUTES } from '$lib/server/db/tokens';
import { resetSchema } from './schema';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ params }) => {
	const { state } = await resetEmailFor(params.token);
	return { state, minutes: RESET_LIFETIME_MINUTES };
};

export const actions: Actions = {
	default: async (event) => {
		const { request, params, cookies, url } = event;
		const link = await resetEmailFor(params.token);
		if (link.state !== 'valid') return failForm(410, { state: link.state });
		const form = readForm(resetSchema, await request.formData());
		if (!form.ok) return failForm(400, { errors: form.errors, state: link.state });
		if (link.email && sameAsEmail(form.data.password, link.email)) return failForm(400, { errors: { password: PASSWORD_IS_EMAIL }, state: link.state });
		const outcome = await resetPassword(params.token, form.data.password, clientAddress(event));
		if (outcome.state !== 'valid') return failForm(410, { errors: {}, state: outcome.state });
		// Every session of the account has ended, this browser's included.
		clearSessionCookie(cookies, url);
		redirect(303, '/sign-in?reset=done');
	}
};
