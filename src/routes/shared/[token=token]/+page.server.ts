import { error } from '@sveltejs/kit';
import { AccessDenied } from '$lib/server/access';
import { linkActor } from '$lib/server/sharing/share-actions';
import { readRevision } from '$lib/server/sharing/sheet-actions';
import type { PageServerLoad } from './$types';

// A read-only link: no account, no history, no names of people — the sheet's newest revision.
export const load: PageServerLoad = async ({ params, setHeaders }) => {
	setHeaders({ 'cache-control': 'private, no-store', 'x-robots-tag': 'noindex' });
	try {
		const actor = await linkActor(params.token);
		const { sheet, revision } = await readRevision(actor, actor.sheetId);
		return {
			sheet: { name: sheet.name, status: sheet.status, updatedAt: sheet.updatedAt },
			revision: { number: revision.number, createdAt: revision.createdAt, document: revision.document, layout: revision.layout }
		};
	} catch (e) {
		if (e instanceof AccessDenied) error(404, 'This link does not open anything: it may have been revoked.');
		throw e;
	}
};
