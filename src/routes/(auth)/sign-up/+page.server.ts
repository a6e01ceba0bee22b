import { redirect } from '@sveltejs/kit';
import { clientAddress } from '$lib/server/auth/client-address';
import { failForm, formState, readForm } from '$lib/server/auth/forms';
import { safeNext } from '$lib/server/auth/next';
import { signUp } from '$lib/server/auth/sign-in';
import { publicOrigin } from '$lib/server/mail';
import { signUpSchema } from './schema';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals, url }) => {
	const next = url.searchParams.get('next');
	if (locals.user) redirect(303, safeNext(next));
	return { next: next ? safeNext(next, '') : '' };
};

export const actions: Actions = {
	// The same answer whether or not the address has an account (see signUp): "check your inbox".
	default: async (event) => {
		const { request, url } = event;
		const form = readForm(signUpSchema, await request.formData());
		if (!form.ok) return failForm(400, { values: form.values, errors: form.errors });
		const next = url.searchParams.get('next');
		const outcome = await signUp({ ...form.data, next: next ? safeNext(next, '') || null : null }, clientAddress(event), publicOrigin(url));
		const values = { name: form.data.name, email: form.data.email };
		if (!outcome.ok) return failForm(429, { values, message: outcome.message });
		return formState({ values, message: outcome.message, sent: true });
	}
};
