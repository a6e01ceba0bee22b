// In-app notifications: one row per person per event, read or not.
import { Op } from 'sequelize';
import { db } from './connection';
import { reviewModels } from './models/review';
import type { NotificationKind } from './models/notification';

export interface NotificationRecord {
	id: string;
	kind: NotificationKind;
	actorId: string | null;
	actorName: string | null;
	sheetId: string | null;
	sheetName: string | null;
	detail: Record<string, unknown>;
	readAt: Date | null;
	createdAt: Date;
}

export async function addNotifications(rows: { userId: string; kind: NotificationKind; actorId: string | null; sheetId: string | null; detail: Record<string, unknown> }[]) {
	if (rows.length) await reviewModels().Notification.bulkCreate(rows.map((r) => ({ ...r, readAt: null })));
}

export async function listNotifications(userId: string, { limit = 50, unreadOnly = false } = {}): Promise<NotificationRecord[]> {
	const [rows] = await db().query(
		`SELECT n.id, n.kind, n.actor_id AS "actorId", u.name AS "actorName", n.sheet_id AS "sheetId", s.name AS "sheetName",
		        n.detail, n.read_at AS "readAt", n.created_at AS "createdAt"
		   FROM notifications n LEFT JOIN users u ON u.id = n.actor_id LEFT JOIN sheets s ON s.id = n.sheet_id
		  WHERE n.user_id = :userId ${unreadOnly ? 'AND n.read_at IS NULL' : ''}
		  ORDER BY n.created_at DESC, n.id DESC LIMIT :limit`,
		{ replacements: { userId, limit: Math.min(Math.max(1, limit), 200) } }
	);
	return rows as NotificationRecord[];
}

export async function unreadCount(userId: string): Promise<number> {
	return reviewModels().Notification.count({ where: { userId, readAt: null } });
}

/** Mark some (or, without ids, all) of a person's notifications read; returns how many changed. */
export async function markRead(userId: string, ids?: string[]): Promise<number> {
	const where = ids ? { userId, readAt: null, id: { [Op.in]: ids } } : { userId, readAt: null };
	const [count] = await reviewModels().Notification.update({ readAt: new Date() }, { where });
	return count;
}
