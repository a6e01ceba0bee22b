// The JSON API's one way to answer: every handler runs inside `endpoint`, which turns the
// domain's exceptions into JSON errors `{ error, ...details }` with the status they stand for.
import { isHttpError, isRedirect, json, type RequestEvent, type RequestHandler } from '@sveltejs/kit';
import type { z } from 'zod';
import { AccessDenied, actorOf, type Actor } from '../access';
import { RevisionConflict, SheetStateError } from '../db/sheets';
import { MembershipRuleError } from '../db/workspaces';
import { InvitationError } from '../db/invitations';
import { ApiProblem } from './problem';

export const BODY_LIMITS = { small: 16_384, document: 2_000_000 };

export { ApiProblem };

export const problem = (status: number, message: string, details: Record<string, unknown> = {}) =>
	json(
		{ error: message, ...details },
		{
			status,
			headers: {
				'cache-control': 'no-store',
				// A busy server (503) or a caller over its share (429) says when to come back.
				...(typeof details.retryAfterSeconds === 'number' ? { 'retry-after': String(details.retryAfterSeconds) } : {})
			}
		}
	);

function toResponse(e: unknown): Response {
	if (e instanceof ApiProblem) return problem(e.status, e.message, e.details);
	if (e instanceof AccessDenied) return problem(e.status, e.message);
	if (e instanceof RevisionConflict) {
		return problem(409, `The sheet is at revision ${e.latest.number}; your save was based on an older one. Merge and save on top of it.`, { latest: e.latest });
	}
	if (e instanceof MembershipRuleError || e instanceof InvitationError || e instanceof SheetStateError) return problem(409, e.message);
	if (isHttpError(e)) return problem(e.status, e.body.message);
	// Unknown errors go on to SvelteKit; hooks.server.ts answers a database outage (503) and
	// PostgreSQL's refusal of a malformed value (400) for every route in one place (faults.ts).
	throw e;
}

export function endpoint(handler: (event: RequestEvent) => Promise<Response>): RequestHandler {
	return async (event) => {
		try {
			return await handler(event);
		} catch (e) {
			if (isRedirect(e)) throw e;
			return toResponse(e);
		}
	};
}

/** The caller as the access module sees them; anonymous calls are turned away with 401. */
export function apiActor(event: RequestEvent): Actor & { kind: 'user' } {
	const actor = actorOf(event.locals);
	if (actor.kind !== 'user') throw new ApiProblem(401, 'Sign in or send an API token (Authorization: Bearer …).');
	return actor;
}

/** Parse a JSON body within `maxBytes` against `schema`; 413, 400 and field issues otherwise. */
export async function readBody<S extends z.ZodType>(request: Request, schema: S, maxBytes = BODY_LIMITS.small): Promise<z.output<S>> {
	if (Number(request.headers.get('content-length') ?? 0) > maxBytes) throw new ApiProblem(413, `The request body is over the ${maxBytes}-byte limit.`);
	const text = await request.text();
	if (Buffer.byteLength(text) > maxBytes) throw new ApiProblem(413, `The request body is over the ${maxBytes}-byte limit.`);
	let data: unknown;
	try {
		data = text.trim() ? JSON.parse(text) : {};
	} catch {
		throw new ApiProblem(400, 'The request body is not valid JSON.');
	}
	const parsed = schema.safeParse(data);
	if (!parsed.success) {
		const issues = parsed.error.issues.map((i) => ({ field: i.path.join('.') || '(body)', message: i.message }));
		throw new ApiProblem(400, `${issues[0].field}: ${issues[0].message}`, { issues });
	}
	return parsed.data;
}
