import { clientAddress } from '$lib/server/auth/client-address';
import { failForm, formState, readForm } from '$lib/server/auth/forms';
import { requestPasswordReset, RESET_SENT } from '$lib/server/auth/passwords';
import { publicOrigin } from '$lib/server/mail';
import { forgotSchema } from './schema';
import type { Actions } from './$types';

export const actions: Actions = {
	default: async (event) => {
		const form = readForm(forgotSchema, await event.request.formData());
		if (!form.ok) return failForm(400, { values: form.values, errors: form.errors, sent: false });
		const outcome = await requestPasswordReset(form.data.email, clientAddress(event), publicOrigin(event.url));
		if (!outcome.ok) return failForm(429, { values: { email: form.data.email }, message: outcome.message, sent: false });
		// The same answer for every address: it never says whether an account exists.
		return formState({ values: { email: form.data.email }, message: RESET_SENT, sent: true });
	}
};
