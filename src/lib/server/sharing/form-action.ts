// Form actions of the workspace and sheet pages: the signed-in actor, the form parsed by its
// schema, and the domain's refusals turned into `fail(status, { section, message })` beside the
// form that caused them. A target the caller cannot see stays a plain 404 page.
import { error, type RequestEvent } from '@sveltejs/kit';
import type { z } from 'zod';
import { AccessDenied, type Actor } from '../access';
import { requireUser } from '../auth/guard';
import { failForm, readForm } from '../auth/forms';
import { RevisionConflict, SheetStateError } from '../db/sheets';
import { MembershipRuleError } from '../db/workspaces';
import { InvitationError } from '../db/invitations';

export function formActor(event: Pick<RequestEvent, 'locals' | 'url'>): Actor & { kind: 'user' } {
	return { kind: 'user', id: requireUser(event.locals, event.url).id };
}

type Outcome = Record<string, unknown> | void;

/**
 * Parse the posted form with `schema` and run `work` with the data. `section` names the form on
 * the page, so its message and field errors show beside it and nowhere else.
 */
export async function formAction<S extends z.ZodType>(
	event: RequestEvent,
	section: string,
	schema: S,
	work: (data: z.output<S>, actor: Actor & { kind: 'user' }) => Promise<Outcome>
) {
	const actor = formActor(event);
	const form = readForm(schema, await event.request.formData());
	if (!form.ok) return failForm(400, { ok: false, section, values: form.values, errors: form.errors, message: Object.values(form.errors)[0] ?? '' });
	try {
		const result = await work(form.data, actor);
		const empty: Record<string, string> = {};
		return { ok: true, section, values: empty, errors: empty, message: '', ...(result ?? {}) };
	} catch (e) {
		if (e instanceof AccessDenied) {
			if (e.status === 404 || e.status === 401) error(e.status, e.message);
			return failForm(e.status, { ok: false, section, message: e.message });
		}
		if (e instanceof RevisionConflict) return failForm(409, { ok: false, section, message: `Someone saved revision ${e.latest.number} meanwhile; reload to see it.` });
		if (e instanceof MembershipRuleError || e instanceof InvitationError || e instanceof SheetStateError) {
			return failForm(409, { ok: false, section, message: e.message });
		}
		throw e;
	}
}
