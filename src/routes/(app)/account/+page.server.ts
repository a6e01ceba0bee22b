import { error, redirect } from '@sveltejs/kit';
import { listAccountAudit, recordAudit } from '$lib/server/audit';
import { clientAddress } from '$lib/server/auth/client-address';
import { failForm, formState, readForm } from '$lib/server/auth/forms';
import { requireUser } from '$lib/server/auth/guard';
import { changePassword } from '$lib/server/auth/passwords';
import { clearSessionCookie, setSessionCookie } from '$lib/server/auth/session';
import { signOut } from '$lib/server/auth/sign-in';
import { createApiToken, listApiTokens, revokeApiToken } from '$lib/server/db/tokens';
import { renameUser } from '$lib/server/db/users';
import { passwordSchema, renameSchema, revokeSchema, tokenNameSchema } from './schema';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals, url }) => {
	const user = requireUser(locals, url);
	const [tokens, activity] = await Promise.all([listApiTokens(user.id), listAccountAudit({ userId: user.id, limit: 15 })]);
	return {
		tokens,
		activity: activity.map((e) => ({ id: e.id, type: e.type, detail: e.detail, ip: e.ip, createdAt: e.createdAt }))
	};
};

export const actions: Actions = {
	rename: async ({ locals, url, request }) => {
		const user = requireUser(locals, url);
		const form = readForm(renameSchema, await request.formData());
		if (!form.ok) return failForm(400, { section: 'profile', values: form.values, errors: form.errors });
		await renameUser(user.id, form.data.name);
		return formState({ section: 'profile', message: 'Name saved.' });
	},
	password: async (event) => {
		const user = requireUser(event.locals, event.url);
		const form = readForm(passwordSchema(user.email), await event.request.formData());
		if (!form.ok) return failForm(400, { section: 'password', errors: form.errors });
		const outcome = await changePassword(user.id, form.data.current, form.data.password, clientAddress(event));
		if (!outcome.ok) return failForm(400, { section: 'password', errors: { current: outcome.message } });
		// Every session ended, this one too; this browser continues on a new one.
		setSessionCookie(event.cookies, outcome.token, outcome.session.expiresAt, event.url);
		return formState({ section: 'password', message: 'Password changed. Every other browser and device was signed out.' });
	},
	createToken: async (event) => {
		const user = requireUser(event.locals, event.url);
		const form = readForm(tokenNameSchema, await event.request.formData());
		if (!form.ok) return failForm(400, { section: 'tokens', values: form.values, errors: form.errors });
		const { token, info } = await createApiToken(user.id, form.data.tokenName);
		await recordAudit({ type: 'token_created', actorId: user.id, detail: { name: info.name, prefix: info.prefix }, ip: clientAddress(event) });
		// Returned once, in this response only: the database keeps just its hash.
		return formState({ section: 'tokens', created: { name: info.name, token } });
	},
	revokeToken: async (event) => {
		const user = requireUser(event.locals, event.url);
		const form = readForm(revokeSchema, await event.request.formData());
		if (!form.ok) error(404, 'No such token');
		const name = await revokeApiToken(user.id, form.data.id);
		if (name === null) error(404, 'No such token');
		await recordAudit({ type: 'token_revoked', actorId: user.id, detail: { name }, ip: clientAddress(event) });
		return formState({ section: 'tokens', message: `Token “${name}” revoked: it no longer works.` });
	},
	signOutEverywhere: async (event) => {
		const user = requireUser(event.locals, event.url);
		await signOut(user.id, event.locals.session?.id ?? '', clientAddress(event), true);
		clearSessionCookie(event.cookies, event.url);
		redirect(303, '/sign-in');
	}
};
