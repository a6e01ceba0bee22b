// The audit log's storage: append and page through, newest first.
import { Op, type WhereOptions } from 'sequelize';
import { models } from './models';
import type { AuditEvent } from './models/audit-event';

export interface AuditRow {
	id: string;
	type: string;
	actorId: string | null;
	actorName: string | null;
	actorEmail: string | null;
	workspaceId: string | null;
	sheetId: string | null;
	detail: Record<string, unknown>;
	ip: string | null;
	createdAt: Date;
}

export async function insertAuditEvent(row: {
	type: string;
	actorId: string | null;
	workspaceId: string | null;
	sheetId: string | null;
	detail: Record<string, unknown>;
	ip: string | null;
}): Promise<void> {
	await models().AuditEvent.create(row);
}

export async function findAuditEvents(where: WhereOptions<AuditEvent>, limit: number, before?: Date): Promise<AuditRow[]> {
	const { AuditEvent, User } = models();
	const rows = await AuditEvent.findAll({
		where: before ? { ...where, createdAt: { [Op.lt]: before } } : where,
		include: [{ model: User, as: 'actor', attributes: ['name', 'email'] }],
		order: [['createdAt', 'DESC'], ['id', 'DESC']],
		limit: Math.min(Math.max(1, Math.floor(limit)), 500)
	});
	return rows.map((r) => {
		const actor = (r as unknown as { actor: { name: string; email: string } | null }).actor;
		return {
			id: r.id,
			type: r.type,
			actorId: r.actorId,
			actorName: actor?.name ?? null,
			actorEmail: actor?.email ?? null,
			workspaceId: r.workspaceId,
			sheetId: r.sheetId,
			detail: r.detail ?? {},
			ip: r.ip,
			createdAt: r.createdAt
		};
	});
}
