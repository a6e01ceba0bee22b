import { error, redirect } from '@sveltejs/kit';
import { AccessDenied, actorOf } from '$lib/server/access';
import { requireUser } from '$lib/server/auth/guard';
import { listRevisions } from '$lib/server/db/sheets';
import { formAction } from '$lib/server/sharing/form-action';
import { answerSpec } from '$lib/server/review/spec-compare';
import { firstAnalysis } from '$lib/server/first-analysis';
import { requestContext } from '$lib/server/sharing/context';
import { checkpointsOf, nameRevisionAs, readRevision, renameSheetAs, restoreRevisionAs, trashSheetAs, duplicateSheetAs } from '$lib/server/sharing/sheet-actions';
import { cancelGuestInvitation, changeGrant, endShareLink, newShareLink, sharingOf, shareWithEmail, unshare } from '$lib/server/sharing/share-actions';
import * as schema from './schema';
import type { Actions, PageServerLoad } from './$types';

// `{ sheet, revision, role, canEdit }` is the contract the canvas editor builds on; the rest
// serves this page's history and sharing panels. ?revision=n opens an older one read-only.
export const load: PageServerLoad = async ({ params, url, locals }) => {
	requireUser(locals, url);
	const actor = actorOf(locals);
	const asked = url.searchParams.get('revision');
	const number = asked && /^[1-9]\d{0,8}$/.test(asked) ? Number(asked) : undefined;
	try {
		const { sheet, workspace, revision, role, can, target } = await readRevision(actor, params.id, number);
		const viewingOld = revision.number !== sheet.latestRevision;
		// The first analysis is rendered into the page (results before any JavaScript; null when
		// the editor should ask itself, see first-analysis.ts).
		const [history, checkpoints, sharing, first] = await Promise.all([listRevisions(sheet.id), checkpointsOf(sheet.id), can('share') ? sharingOf(actor, sheet.id) : null, firstAnalysis(revision.document, revision.layout)]);
		return {
			sheet,
			revision,
			firstAnalysis: first,
			role,
			canEdit: can('save') && !viewingOld,
			viewingOld,
			workspace: { id: workspace.id, name: workspace.name, member: target.workspaceRole !== null },
			history,
			checkpoints,
			sharing,
			may: { rename: can('rename'), restore: can('save'), trash: can('trash'), duplicate: can('duplicate'), comment: can('comment') },
			// Past the long canvas, straight to what a reader came for (drawn by the root layout).
			skipLinks: [
				{ href: '#results', label: 'Skip to the results' },
				{ href: '#review-panel', label: 'Skip to the review' },
				...(can('comment') ? [{ href: '#new-comment', label: 'Skip to a new comment' }] : [{ href: '#comments', label: 'Skip to the comments' }])
			],
			// Streamed (not awaited): the review answer's spec verdicts follow the page in.
			reviewSpec: answerSpec(actor, sheet.id).catch(() => null)
		};
	} catch (e) {
		if (e instanceof AccessDenied) error(e.status === 409 ? 404 : e.status, e.message);
		throw e;
	}
};

export const actions: Actions = {
	rename: (event) =>
		formAction(event, 'rename', schema.renameSchema, async ({ name }, actor) => {
			await renameSheetAs(actor, event.params.id, name);
			return { message: 'Name saved.' };
		}),
	restore: (event) =>
		formAction(event, 'history', schema.restoreSchema, async ({ number }, actor) => {
			const revision = await restoreRevisionAs(actor, event.params.id, number);
			redirect(303, `/sheets/${event.params.id}?restored=${number}&as=${revision.number}`);
		}),
	nameRevision: (event) =>
		formAction(event, 'history', schema.nameRevisionSchema, async ({ number, name, message }, actor) => {
			await nameRevisionAs(actor, event.params.id, number, name || null, message || null);
			return { message: name ? `Revision ${number} is now “${name}”.` : `Revision ${number} has no name now.` };
		}),
	trash: (event) =>
		formAction(event, 'sheet', schema.emptySchema, async (_d, actor) => {
			const sheet = await trashSheetAs(actor, event.params.id);
			redirect(303, `/workspaces/${sheet.workspaceId}/trash`);
		}),
	duplicate: (event) =>
		formAction(event, 'sheet', schema.emptySchema, async (_d, actor) => {
			const { sheet } = await duplicateSheetAs(actor, event.params.id);
			redirect(303, `/sheets/${sheet.id}`);
		}),
	share: (event) =>
		formAction(event, 'share', schema.shareSchema, async (data, actor) => {
			const { outcome } = await shareWithEmail(actor, event.params.id, data, requestContext(event));
			return { message: outcome === 'granted' ? `${data.email} can now open this sheet as ${data.role}.` : `${data.email} has no account yet: we sent a guest invitation for this sheet.` };
		}),
	grant: (event) =>
		formAction(event, 'people', schema.grantSchema, async ({ userId, role }, actor) => {
			await changeGrant(actor, event.params.id, userId, role, requestContext(event));
			return { message: `Role changed to ${role}.` };
		}),
	unshare: (event) =>
		formAction(event, 'people', schema.personSchema, async ({ userId }, actor) => {
			await unshare(actor, event.params.id, userId, requestContext(event));
			return { message: 'Access withdrawn.' };
		}),
	revokeGuest: (event) =>
		formAction(event, 'people', schema.invitationIdSchema, async ({ invitationId }, actor) => {
			await cancelGuestInvitation(actor, event.params.id, invitationId);
			return { message: 'Guest invitation revoked.' };
		}),
	createLink: (event) =>
		formAction(event, 'links', schema.linkSchema, async ({ label }, actor) => {
			const { url } = await newShareLink(actor, event.params.id, label || null, requestContext(event));
			return { message: 'Read-only link made. Copy it now: it is shown only this once.', linkUrl: url };
		}),
	revokeLink: (event) =>
		formAction(event, 'links', schema.linkIdSchema, async ({ linkId }, actor) => {
			await endShareLink(actor, event.params.id, linkId, requestContext(event));
			return { message: 'Link revoked: it no longer opens the sheet.' };
		})
};
