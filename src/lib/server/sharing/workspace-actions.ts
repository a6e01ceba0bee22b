// What people do to workspaces, shared by the pages' form actions and the JSON API. Each verb
// asks access.ts first, then changes the data, then mails and audits.
import { authorizeWorkspace, AccessDenied, type Actor } from '../access';
import { recordAudit } from '../audit';
import { findUserByEmail } from '../db/users';
import { createInvitation, listPendingInvitations, revokeInvitation } from '../db/invitations';
import {
	changeRole,
	createWorkspace,
	getMembership,
	listMembers,
	MembershipRuleError,
	removeMember,
	transferOwnership,
	updateWorkspace
} from '../db/workspaces';
import type { SheetRole } from '../db/models/workspace';
import { invitationMail, sendMail } from '../mail';

type UserActor = Actor & { kind: 'user' };
export interface Context {
	/** Public base URL for links in mail, e.g. https://polewise.example.com */
	origin: string;
	ip?: string | null;
	actorName: string;
}

export const newWorkspace = (actor: UserActor, name: string) => createWorkspace(actor.id, name);

export async function updateWorkspaceSettings(actor: Actor, workspaceId: string, changes: { name?: string; defaultSheetRole?: SheetRole }) {
	await authorizeWorkspace(actor, workspaceId, 'manage_workspace');
	return updateWorkspace(workspaceId, changes);
}

export async function inviteToWorkspace(actor: UserActor, workspaceId: string, input: { email: string; role: 'admin' | 'member' }, ctx: Context) {
	const { workspace } = await authorizeWorkspace(actor, workspaceId, 'manage_members');
	const existing = await findUserByEmail(input.email);
	if (existing && (await getMembership(workspaceId, existing.id))) {
		throw new MembershipRuleError(`${input.email} is already a member of this workspace.`);
	}
	const { invitation, token } = await createInvitation({ workspaceId, email: input.email, role: input.role, invitedBy: actor.id });
	const url = `${ctx.origin}/invitations/${token}`;
	await sendMail({ to: invitation.email, ...invitationMail({ inviterName: ctx.actorName, workspaceName: workspace.name, role: input.role, url }) });
	await recordAudit({ type: 'invitation_sent', actorId: actor.id, workspaceId, detail: { email: invitation.email, role: input.role }, ip: ctx.ip });
	return invitation;
}

export async function pendingInvitations(actor: Actor, workspaceId: string) {
	await authorizeWorkspace(actor, workspaceId, 'manage_members');
	return listPendingInvitations(workspaceId);
}

export async function cancelInvitation(actor: Actor, workspaceId: string, invitationId: string) {
	await authorizeWorkspace(actor, workspaceId, 'manage_members');
	if (!(await revokeInvitation(workspaceId, invitationId))) throw new AccessDenied(404, 'No pending invitation with that id.');
}

export async function workspaceMembers(actor: Actor, workspaceId: string) {
	await authorizeWorkspace(actor, workspaceId, 'list');
	return listMembers(workspaceId);
}

/** Owners and admins manage members, but only an owner may act on another owner. */
async function authorizeMemberChange(actor: UserActor, workspaceId: string, userId: string) {
	const access = await authorizeWorkspace(actor, workspaceId, 'manage_members');
	const target = await getMembership(workspaceId, userId);
	if (!target) throw new AccessDenied(404, 'That person is not a member of this workspace.');
	if (target.role === 'owner' && access.role !== 'owner') throw new AccessDenied(403, 'Only an owner can change or remove another owner.');
	return { access, target };
}

export async function setMemberRole(actor: UserActor, workspaceId: string, userId: string, role: 'admin' | 'member', ctx: Pick<Context, 'ip'>) {
	const { target } = await authorizeMemberChange(actor, workspaceId, userId);
	await changeRole(workspaceId, userId, role);
	await recordAudit({ type: 'role_changed', actorId: actor.id, workspaceId, detail: { userId, from: target.role, to: role }, ip: ctx.ip });
}

export async function removeFromWorkspace(actor: UserActor, workspaceId: string, userId: string, ctx: Pick<Context, 'ip'>) {
	if (userId === actor.id) return leaveWorkspace(actor, workspaceId, ctx);
	const { target } = await authorizeMemberChange(actor, workspaceId, userId);
	await removeMember(workspaceId, userId);
	await recordAudit({ type: 'member_removed', actorId: actor.id, workspaceId, detail: { userId, role: target.role }, ip: ctx.ip });
}

export async function leaveWorkspace(actor: UserActor, workspaceId: string, ctx: Pick<Context, 'ip'>) {
	const { role } = await authorizeWorkspace(actor, workspaceId, 'leave');
	await removeMember(workspaceId, actor.id);
	await recordAudit({ type: 'member_removed', actorId: actor.id, workspaceId, detail: { userId: actor.id, role, left: true }, ip: ctx.ip });
}

export async function handOverOwnership(actor: UserActor, workspaceId: string, toUserId: string, ctx: Pick<Context, 'ip'>) {
	await authorizeWorkspace(actor, workspaceId, 'transfer_ownership');
	if (!(await getMembership(workspaceId, toUserId))) throw new AccessDenied(404, 'That person is not a member of this workspace.');
	await transferOwnership(workspaceId, actor.id, toUserId);
	await recordAudit({ type: 'ownership_transferred', actorId: actor.id, workspaceId, detail: { from: actor.id, to: toUserId }, ip: ctx.ip });
}
