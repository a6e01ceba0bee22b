import { redirect } from '@sveltejs/kit';
import { clientAddress } from '$lib/server/auth/client-address';
import { failForm, readForm } from '$lib/server/auth/forms';
import { safeNext } from '$lib/server/auth/next';
import { invalidateSession, setSessionCookie } from '$lib/server/auth/session';
import { signUp } from '$lib/server/auth/sign-in';
import { signUpSchema } from './schema';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals, url }) => {
	const next = url.searchParams.get('next');
	if (locals.user) redirect(303, safeNext(next));
	return { next: next ? safeNext(next, '') : '' };
};

export const actions: Actions = {
	default: async (event) => {
		const { request, cookies, url, locals } = event;
		const form = readForm(signUpSchema, await request.formData());
		if (!form.ok) return failForm(400, { values: form.values, errors: form.errors });
		const outcome = await signUp(form.data, clientAddress(event));
		if (!outcome.ok) {
			const values = { name: form.data.name, email: form.data.email };
			if (outcome.field === 'email') return failForm(400, { values, errors: { email: outcome.message } });
			return failForm(429, { values, message: outcome.message });
		}
		if (locals.session) await invalidateSession(locals.session.id);
		setSessionCookie(cookies, outcome.token, outcome.session.expiresAt, url);
		redirect(303, safeNext(url.searchParams.get('next')));
	}
};
