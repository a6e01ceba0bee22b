// Invitations by e-mail: to a workspace (role admin or member) or, as a guest, to one sheet
// (role editor, commenter or viewer). The link carries a random token; only its hash is stored.
// An invitation is single-use, revocable, and expires after INVITATION_DAYS.
import { Op } from 'sequelize';
import { db } from './connection';
import { sharingModels } from './models/sharing';
import { hashSecretToken, newSecretToken, TOKEN_PATTERN } from '../sharing/secret-token';

export const INVITATION_DAYS = 7;

export type InvitationStatus = 'pending' | 'accepted' | 'revoked' | 'expired';

export interface InvitationRecord {
	id: string;
	workspaceId: string;
	workspaceName: string;
	sheetId: string | null;
	sheetName: string | null;
	email: string;
	role: string;
	inviterName: string | null;
	expiresAt: Date;
	createdAt: Date;
	status: InvitationStatus;
}

export class InvitationError extends Error {}

function statusOf(row: { acceptedAt: Date | null; revokedAt: Date | null; expiresAt: Date }, now = new Date()): InvitationStatus {
	if (row.acceptedAt) return 'accepted';
	if (row.revokedAt) return 'revoked';
	return row.expiresAt <= now ? 'expired' : 'pending';
}

const SELECT = `SELECT i.id, i.workspace_id AS "workspaceId", w.name AS "workspaceName", i.sheet_id AS "sheetId", s.name AS "sheetName",
       i.email, i.role, u.name AS "inviterName", i.expires_at AS "expiresAt", i.created_at AS "createdAt",
       i.accepted_at AS "acceptedAt", i.revoked_at AS "revokedAt"
  FROM invitations i JOIN workspaces w ON w.id = i.workspace_id
  LEFT JOIN sheets s ON s.id = i.sheet_id LEFT JOIN users u ON u.id = i.invited_by`;

type Row = InvitationRecord & { acceptedAt: Date | null; revokedAt: Date | null };
const record = ({ acceptedAt, revokedAt, ...rest }: Row): InvitationRecord => ({ ...rest, status: statusOf({ acceptedAt, revokedAt, expiresAt: rest.expiresAt }) });

/** Issue an invitation; a pending one to the same address and target is replaced. */
export async function createInvitation(input: {
	workspaceId: string;
	sheetId?: string | null;
	email: string;
	role: string;
	invitedBy: string;
	now?: Date;
}): Promise<{ invitation: InvitationRecord; token: string }> {
	const { Invitation } = sharingModels();
	const email = input.email.trim().toLowerCase();
	const sheetId = input.sheetId ?? null;
	const now = input.now ?? new Date();
	const token = newSecretToken();
	const id = await db().transaction(async (transaction) => {
		await Invitation.update(
			{ revokedAt: now },
			{ where: { workspaceId: input.workspaceId, sheetId, email, acceptedAt: null, revokedAt: null }, transaction }
		);
		const row = await Invitation.create(
			{
				workspaceId: input.workspaceId,
				sheetId,
				email,
				role: input.role,
				invitedBy: input.invitedBy,
				tokenHash: hashSecretToken(token),
				expiresAt: new Date(now.getTime() + INVITATION_DAYS * 86_400_000)
			},
			{ transaction }
		);
		return row.id;
	});
	return { invitation: (await getInvitationById(id))!, token };
}

async function getInvitationById(id: string): Promise<InvitationRecord | null> {
	const [rows] = await db().query(`${SELECT} WHERE i.id = :id`, { replacements: { id } });
	return rows.length ? record(rows[0] as Row) : null;
}

export async function findInvitation(token: string): Promise<InvitationRecord | null> {
	if (!TOKEN_PATTERN.test(token)) return null;
	const [rows] = await db().query(`${SELECT} WHERE i.token_hash = :hash`, { replacements: { hash: hashSecretToken(token) } });
	return rows.length ? record(rows[0] as Row) : null;
}

/** Pending workspace invitations (guest invitations show on their sheet), newest first. */
export async function listPendingInvitations(workspaceId: string, { sheetId }: { sheetId?: string } = {}): Promise<InvitationRecord[]> {
	const [rows] = await db().query(
		`${SELECT} WHERE i.workspace_id = :workspaceId AND ${sheetId ? 'i.sheet_id = :sheetId' : 'i.sheet_id IS NULL'}
		   AND i.accepted_at IS NULL AND i.revoked_at IS NULL AND i.expires_at > now() ORDER BY i.created_at DESC`,
		{ replacements: { workspaceId, sheetId: sheetId ?? null } }
	);
	return (rows as Row[]).map(record);
}

export async function revokeInvitation(workspaceId: string, id: string): Promise<boolean> {
	const [count] = await sharingModels().Invitation.update(
		{ revokedAt: new Date() },
		{ where: { id, workspaceId, acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } } }
	);
	return count > 0;
}

/**
 * Accept as `user`: the signed-in address must be the invited one, so a forwarded link does
 * not let someone else in. Joins the workspace, or for a guest invitation grants the one sheet.
 */
export async function acceptInvitation(token: string, user: { id: string; email: string }): Promise<InvitationRecord> {
	const { Invitation, Membership, SheetGrant } = sharingModels();
	const found = await findInvitation(token);
	if (!found) throw new InvitationError('This invitation link is not valid.');
	if (found.status !== 'pending') throw new InvitationError(`This invitation is ${found.status}.`);
	if (found.email !== user.email.trim().toLowerCase()) {
		throw new InvitationError(`This invitation was sent to ${found.email}; you are signed in as ${user.email}.`);
	}
	await db().transaction(async (transaction) => {
		// The conditional update is the single-use guard: a second accept finds nothing to claim.
		const [claimed] = await Invitation.update(
			{ acceptedAt: new Date(), acceptedBy: user.id },
			{ where: { id: found.id, acceptedAt: null, revokedAt: null }, transaction }
		);
		if (claimed === 0) throw new InvitationError('This invitation was already used.');
		if (found.sheetId) {
			const [grant, created] = await SheetGrant.findOrCreate({
				where: { sheetId: found.sheetId, userId: user.id },
				defaults: { sheetId: found.sheetId, userId: user.id, role: found.role as 'viewer', grantedBy: null },
				transaction
			});
			if (!created) await grant.update({ role: found.role as 'viewer' }, { transaction });
		} else {
			const existing = await Membership.findOne({ where: { workspaceId: found.workspaceId, userId: user.id }, transaction });
			if (!existing) await Membership.create({ workspaceId: found.workspaceId, userId: user.id, role: found.role as 'member' }, { transaction });
			else if (existing.role === 'member' && found.role === 'admin') await existing.update({ role: 'admin' }, { transaction });
		}
	});
	return { ...found, status: 'accepted' };
}
