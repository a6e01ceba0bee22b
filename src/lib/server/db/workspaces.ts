// Workspace and membership verbs. Who may call them is decided by access.ts; these keep the
// invariants that hold whoever calls: a workspace always has at least one owner.
import { Op } from 'sequelize';
import { db } from './connection';
import { models } from './models';
import type { WorkspaceRole } from './models/membership';
import type { SheetRole } from './models/workspace';

export interface WorkspaceRecord {
	id: string;
	name: string;
	defaultSheetRole: SheetRole;
	createdAt: Date;
	updatedAt: Date;
}

export interface MemberRecord {
	userId: string;
	name: string;
	email: string;
	role: WorkspaceRole;
	joinedAt: Date;
}

export class MembershipRuleError extends Error {}

const plain = <T>(row: { get(options: { plain: true }): unknown }) => row.get({ plain: true }) as T;

export async function createWorkspace(userId: string, name: string): Promise<WorkspaceRecord> {
	const { Workspace, Membership } = models();
	return db().transaction(async (transaction) => {
		const workspace = await Workspace.create({ name }, { transaction });
		await Membership.create({ workspaceId: workspace.id, userId, role: 'owner' }, { transaction });
		return plain<WorkspaceRecord>(workspace);
	});
}

export async function getWorkspace(id: string): Promise<WorkspaceRecord | null> {
	const row = await models().Workspace.findByPk(id);
	return row ? plain<WorkspaceRecord>(row) : null;
}

export async function updateWorkspace(id: string, changes: { name?: string; defaultSheetRole?: SheetRole }): Promise<WorkspaceRecord> {
	const row = await models().Workspace.findByPk(id, { rejectOnEmpty: true });
	await row.update(changes);
	return plain<WorkspaceRecord>(row);
}

export async function getMembership(workspaceId: string, userId: string): Promise<{ role: WorkspaceRole } | null> {
	const row = await models().Membership.findOne({ where: { workspaceId, userId }, attributes: ['role'] });
	return row ? { role: row.role } : null;
}

/** The caller's workspaces with their role, sheet count and member count, by name. */
export async function listWorkspacesFor(userId: string) {
	const [rows] = await db().query(
		`SELECT w.id, w.name, w.default_sheet_role AS "defaultSheetRole", m.role,
		        (SELECT count(*)::int FROM sheets s WHERE s.workspace_id = w.id AND s.trashed_at IS NULL) AS "sheetCount",
		        (SELECT count(*)::int FROM memberships o WHERE o.workspace_id = w.id) AS "memberCount"
		   FROM workspaces w JOIN memberships m ON m.workspace_id = w.id AND m.user_id = :userId
		  ORDER BY lower(w.name), w.id`,
		{ replacements: { userId } }
	);
	return rows as { id: string; name: string; defaultSheetRole: SheetRole; role: WorkspaceRole; sheetCount: number; memberCount: number }[];
}

export async function listMembers(workspaceId: string): Promise<MemberRecord[]> {
	const { Membership, User } = models();
	const rows = await Membership.findAll({
		where: { workspaceId },
		include: [{ model: User, as: 'user', attributes: ['id', 'name', 'email'] }],
		order: [['createdAt', 'ASC']]
	});
	return rows.map((m) => {
		const user = (m as unknown as { user: { id: string; name: string; email: string } }).user;
		return { userId: user.id, name: user.name, email: user.email, role: m.role, joinedAt: m.createdAt };
	});
}

async function ownerCount(workspaceId: string, transaction: import('sequelize').Transaction) {
	return models().Membership.count({ where: { workspaceId, role: 'owner' }, transaction });
}

/** Add a member, or keep the existing membership (never lowers a role). */
export async function addMember(workspaceId: string, userId: string, role: WorkspaceRole): Promise<{ added: boolean }> {
	const { Membership } = models();
	const [, created] = await Membership.findOrCreate({ where: { workspaceId, userId }, defaults: { workspaceId, userId, role } });
	return { added: created };
}

/** Change a member's role between admin and member. Owners change hands only by transfer. */
export async function changeRole(workspaceId: string, userId: string, role: 'admin' | 'member'): Promise<void> {
	const { Membership } = models();
	await db().transaction(async (transaction) => {
		const row = await Membership.findOne({ where: { workspaceId, userId }, transaction, lock: transaction.LOCK.UPDATE });
		if (!row) throw new MembershipRuleError('That person is not a member of this workspace.');
		if (row.role === 'owner') throw new MembershipRuleError('An owner’s role changes only by transferring ownership.');
		await row.update({ role }, { transaction });
	});
}

export async function removeMember(workspaceId: string, userId: string): Promise<void> {
	const { Membership } = models();
	await db().transaction(async (transaction) => {
		const row = await Membership.findOne({ where: { workspaceId, userId }, transaction, lock: transaction.LOCK.UPDATE });
		if (!row) throw new MembershipRuleError('That person is not a member of this workspace.');
		if (row.role === 'owner' && (await ownerCount(workspaceId, transaction)) <= 1) {
			throw new MembershipRuleError('The last owner cannot leave or be removed; transfer ownership first.');
		}
		await row.destroy({ transaction });
		// Grants were given for work in this workspace; a former member keeps none of them.
		await db().query(
			`DELETE FROM sheet_grants g USING sheets s WHERE g.sheet_id = s.id AND s.workspace_id = :workspaceId AND g.user_id = :userId`,
			{ replacements: { workspaceId, userId }, transaction }
		);
	});
}

/** Make `toUserId` (already a member) an owner and the previous owner an admin. */
export async function transferOwnership(workspaceId: string, fromUserId: string, toUserId: string): Promise<void> {
	const { Membership } = models();
	if (fromUserId === toUserId) throw new MembershipRuleError('You already own this workspace.');
	await db().transaction(async (transaction) => {
		const rows = await Membership.findAll({
			where: { workspaceId, userId: { [Op.in]: [fromUserId, toUserId] } },
			transaction,
			lock: transaction.LOCK.UPDATE
		});
		const from = rows.find((r) => r.userId === fromUserId);
		const to = rows.find((r) => r.userId === toUserId);
		if (!from || from.role !== 'owner') throw new MembershipRuleError('Only an owner can transfer ownership.');
		if (!to) throw new MembershipRuleError('Ownership can go only to a member of this workspace.');
		await to.update({ role: 'owner' }, { transaction });
		await from.update({ role: 'admin' }, { transaction });
	});
}
