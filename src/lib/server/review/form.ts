// Form actions of the review pages (meetings, notifications). Like the sharing pages' helper,
// but fields named in `lists` keep every value (checkbox groups), and a refusal from the review
// verbs (ApiProblem, AccessDenied) shows beside the form with its own status.
import { error, type RequestEvent } from '@sveltejs/kit';
import type { z } from 'zod';
import { AccessDenied, type Actor } from '../access';
import { ApiProblem } from '../api/respond';
import { failForm } from '../auth/forms';
import { formActor } from '../sharing/form-action';

export async function reviewForm<S extends z.ZodType>(
	event: RequestEvent,
	section: string,
	schema: S,
	work: (data: z.output<S>, actor: Actor & { kind: 'user' }) => Promise<Record<string, unknown> | void>,
	lists: string[] = []
) {
	const actor = formActor(event);
	const form = await event.request.formData();
	const raw: Record<string, string | string[]> = {};
	for (const [key, value] of form) {
		if (typeof value !== 'string') continue;
		if (lists.includes(key)) raw[key] = [...((raw[key] as string[]) ?? []), value];
		else raw[key] = value;
	}
	for (const key of lists) raw[key] ??= [];
	const parsed = schema.safeParse(raw);
	const values = Object.fromEntries(Object.entries(raw).filter(([, v]) => typeof v === 'string').map(([k, v]) => [k, (v as string).slice(0, 300)]));
	if (!parsed.success) {
		const errors: Record<string, string> = {};
		for (const issue of parsed.error.issues) errors[String(issue.path[0] ?? 'form')] ??= issue.message;
		return failForm(400, { ok: false, section, values, errors, message: Object.values(errors)[0] ?? '' });
	}
	try {
		const none: Record<string, string> = {};
		return { ok: true, section, values: none, errors: none, message: '', ...((await work(parsed.data, actor)) ?? {}) };
	} catch (e) {
		if (e instanceof AccessDenied && (e.status === 404 || e.status === 401)) error(e.status, e.message);
		if (e instanceof AccessDenied || e instanceof ApiProblem) return failForm(e.status, { ok: false, section, values, message: e.message });
		throw e;
	}
}
