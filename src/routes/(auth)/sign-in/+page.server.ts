import { redirect } from '@sveltejs/kit';
import { clientAddress } from '$lib/server/auth/client-address';
import { failForm, readForm } from '$lib/server/auth/forms';
import { safeNext } from '$lib/server/auth/next';
import { invalidateSession, setSessionCookie } from '$lib/server/auth/session';
import { signIn } from '$lib/server/auth/sign-in';
import { signInSchema } from './schema';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals, url }) => {
	const next = url.searchParams.get('next');
	if (locals.user) redirect(303, safeNext(next));
	return { next: next ? safeNext(next, '') : '', reset: url.searchParams.get('reset') === 'done' };
};

export const actions: Actions = {
	default: async (event) => {
		const { request, cookies, url, locals } = event;
		const form = readForm(signInSchema, await request.formData());
		if (!form.ok) return failForm(400, { values: form.values, errors: form.errors });
		const outcome = await signIn(form.data.email, form.data.password, clientAddress(event));
		if (!outcome.ok) {
			return failForm(outcome.reason === 'limited' ? 429 : 400, { values: { email: form.data.email }, message: outcome.message });
		}
		// A fresh session id at every sign-in; whatever session this browser had before ends.
		if (locals.session) await invalidateSession(locals.session.id);
		setSessionCookie(cookies, outcome.token, outcome.session.expiresAt, url);
		redirect(303, safeNext(url.searchParams.get('next')));
	}
};
