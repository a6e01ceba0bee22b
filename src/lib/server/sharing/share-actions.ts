// Sharing one sheet: grants to people (members or guests), guest invitations for addresses
// without an account yet, and read-only links. Every verb asks access.ts for 'share' first.
import { AccessDenied, authorizeSheet, type Actor } from '../access';
import { recordAudit } from '../audit';
import { findUserByEmail } from '../db/users';
import { listGrants, removeGrant, setGrant } from '../db/grants';
import { createInvitation, listPendingInvitations, revokeInvitation } from '../db/invitations';
import { createShareLink, listShareLinks, revokeShareLink, sheetIdForShareToken } from '../db/share-links';
import type { SheetRole } from '../db/models/workspace';
import { sendMail, sheetSharedMail } from '../mail';
import type { Context } from './workspace-actions';

type UserActor = Actor & { kind: 'user' };

export async function sharingOf(actor: Actor, sheetId: string) {
	const { sheet } = await authorizeSheet(actor, sheetId, 'share');
	const [grants, links, invitations] = await Promise.all([
		listGrants(sheetId),
		listShareLinks(sheetId),
		listPendingInvitations(sheet.workspaceId, { sheetId })
	]);
	return { grants, links, invitations };
}

/**
 * Share with an address: someone with an account gets the grant now; anyone else gets a guest
 * invitation for this sheet. Both are told by mail.
 */
export async function shareWithEmail(actor: UserActor, sheetId: string, input: { email: string; role: SheetRole }, ctx: Context) {
	const { sheet } = await authorizeSheet(actor, sheetId, 'share');
	const user = await findUserByEmail(input.email);
	let url = `${ctx.origin}/sheets/${sheetId}`;
	let outcome: 'granted' | 'invited' = 'granted';
	if (user) {
		if (user.id === actor.id) throw new AccessDenied(409, 'You already have this sheet.');
		await setGrant(sheetId, user.id, input.role, actor.id);
	} else {
		const { token } = await createInvitation({ workspaceId: sheet.workspaceId, sheetId, email: input.email, role: input.role, invitedBy: actor.id });
		url = `${ctx.origin}/invitations/${token}`;
		outcome = 'invited';
	}
	await sendMail({ to: input.email, ...sheetSharedMail({ sharerName: ctx.actorName, sheetName: sheet.name, role: input.role, url }) });
	await recordAudit({
		type: 'sheet_shared',
		actorId: actor.id,
		workspaceId: sheet.workspaceId,
		sheetId,
		detail: { email: input.email, role: input.role, outcome },
		ip: ctx.ip
	});
	return { outcome, userId: user?.id ?? null };
}

export async function changeGrant(actor: UserActor, sheetId: string, userId: string, role: SheetRole, ctx: Pick<Context, 'ip'>) {
	const { sheet } = await authorizeSheet(actor, sheetId, 'share');
	if (!(await listGrants(sheetId)).some((g) => g.userId === userId)) throw new AccessDenied(404, 'That person has no grant on this sheet.');
	await setGrant(sheetId, userId, role, actor.id);
	await recordAudit({ type: 'sheet_shared', actorId: actor.id, workspaceId: sheet.workspaceId, sheetId, detail: { userId, role }, ip: ctx.ip });
}

export async function unshare(actor: UserActor, sheetId: string, userId: string, ctx: Pick<Context, 'ip'>) {
	const { sheet } = await authorizeSheet(actor, sheetId, 'share');
	if (!(await removeGrant(sheetId, userId))) throw new AccessDenied(404, 'That person has no grant on this sheet.');
	await recordAudit({ type: 'sheet_unshared', actorId: actor.id, workspaceId: sheet.workspaceId, sheetId, detail: { userId }, ip: ctx.ip });
}

export async function cancelGuestInvitation(actor: UserActor, sheetId: string, invitationId: string) {
	const { sheet } = await authorizeSheet(actor, sheetId, 'share');
	const pending = await listPendingInvitations(sheet.workspaceId, { sheetId });
	if (!pending.some((i) => i.id === invitationId) || !(await revokeInvitation(sheet.workspaceId, invitationId))) {
		throw new AccessDenied(404, 'No pending invitation with that id on this sheet.');
	}
}

export async function newShareLink(actor: UserActor, sheetId: string, label: string | null, ctx: Context) {
	const { sheet } = await authorizeSheet(actor, sheetId, 'share');
	const { link, token } = await createShareLink(sheetId, actor.id, label);
	await recordAudit({ type: 'sheet_shared', actorId: actor.id, workspaceId: sheet.workspaceId, sheetId, detail: { link: link.id }, ip: ctx.ip });
	return { link, token, url: `${ctx.origin}/shared/${token}` };
}

export async function endShareLink(actor: UserActor, sheetId: string, linkId: string, ctx: Pick<Context, 'ip'>) {
	const { sheet } = await authorizeSheet(actor, sheetId, 'share');
	if (!(await revokeShareLink(sheetId, linkId))) throw new AccessDenied(404, 'No live link with that id on this sheet.');
	await recordAudit({ type: 'sheet_unshared', actorId: actor.id, workspaceId: sheet.workspaceId, sheetId, detail: { link: linkId }, ip: ctx.ip });
}

/** The actor a read-only link stands for; an unknown or revoked token is simply not found. */
export async function linkActor(token: string): Promise<Actor & { kind: 'link' }> {
	const sheetId = await sheetIdForShareToken(token);
	if (!sheetId) throw new AccessDenied(404, 'This link does not open anything: it may have been revoked.');
	return { kind: 'link', sheetId };
}
