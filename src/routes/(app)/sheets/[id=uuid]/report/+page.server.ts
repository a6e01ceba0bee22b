// The review report of one revision (?revision=n, default the latest), print-friendly; the PDF
// download prints this same page in headless Chromium (docs/exchange.md).
import { error } from '@sveltejs/kit';
import { AccessDenied, actorOf } from '$lib/server/access';
import { ApiProblem } from '$lib/server/api/respond';
import { requireUser } from '$lib/server/auth/guard';
import { reportData } from '$lib/server/exchange/report-data';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ params, url, locals }) => {
	requireUser(locals, url);
	try {
		return {
			report: await reportData(actorOf(locals), params.id, url),
			generatedAt: new Date(),
			printing: url.searchParams.get('print') === '1'
		};
	} catch (e) {
		if (e instanceof AccessDenied) error(e.status === 409 ? 404 : e.status, e.message);
		if (e instanceof ApiProblem) error(e.status, e.message);
		throw e;
	}
};
