// Every /api address that no route answers ends here. Routes take ids through the `[x=uuid]`
// matcher, so `/api/sheets/not-an-id` matches no route: when the address would match a route
// but for a malformed id, the answer is a 400 naming that path parameter; otherwise a JSON 404.
import type { RequestHandler } from '@sveltejs/kit';
import { problem } from '$lib/server/api/respond';
import { badId } from '$lib/server/api/ids';
import { match as isUuidParam } from '../../../params/uuid';
import { match as isRevisionParam } from '../../../params/revision';
import { match as isTokenParam } from '../../../params/token';

// The route folders under /api, e.g. ["sheets", "[id=uuid]", "attachments"], read at build time.
const templates = Object.keys(import.meta.glob('/src/routes/api/**/+server.ts'))
	.map((file) =>
		file
			.replace(/^\/src\/routes\/api\/|\/?\+server\.ts$/g, '')
			.split('/')
			.filter(Boolean)
	)
	.filter((t) => !t.some((s) => s.startsWith('[...')));

const matchers: Record<string, (value: string) => boolean> = {
	uuid: isUuidParam,
	revision: isRevisionParam,
	token: isTokenParam
};

/** The first parameter that keeps `segments` from matching a template whose words all fit. */
function badParameter(segments: string[]) {
	for (const template of templates) {
		if (template.length !== segments.length) continue;
		let bad: { name: string; kind: string; value: string } | null = null;
		const fits = template.every((part, i) => {
			const param = /^\[(\w+)=(\w+)\]$/.exec(part);
			if (!param) return part === segments[i] || /^\[\w+\]$/.test(part);
			if (!bad && !(matchers[param[2]]?.(segments[i]) ?? true))
				bad = { name: param[1], kind: param[2], value: segments[i] };
			return true;
		});
		if (fits && bad) return bad as { name: string; kind: string; value: string };
	}
	return null;
}

const answer: RequestHandler = ({ params }) => {
	const segments = (params.path ?? '').split('/').filter(Boolean);
	const bad = badParameter(segments);
	if (bad?.kind === 'uuid') {
		const e = badId(bad.name, bad.value, 'path');
		return problem(400, e.message, e.details);
	}
	if (bad?.kind === 'revision')
		return problem(
			400,
			`${bad.name}: a revision number is a whole number from 1 (path parameter "${bad.name}")`,
			{ code: 'bad_parameter' }
		);
	// A malformed share or invitation token is simply not found, like an unknown one.
	return problem(404, 'No such API address. See docs/api.md for the routes.');
};

export const fallback = answer;
