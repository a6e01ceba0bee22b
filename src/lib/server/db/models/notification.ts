import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export const NOTIFICATION_KINDS = ['mention', 'reply', 'review_requested', 'review_answered'] as const;
export type NotificationKind = (typeof NOTIFICATION_KINDS)[number];

export class Notification extends Model<InferAttributes<Notification>, InferCreationAttributes<Notification>> {
	declare id: CreationOptional<string>;
	declare userId: string;
	declare kind: NotificationKind;
	declare actorId: string | null;
	declare sheetId: string | null;
	declare detail: CreationOptional<Record<string, unknown>>;
	declare readAt: Date | null;
	declare createdAt: CreationOptional<Date>;
}

/** Review work on a sheet or in a workspace (saves and shares come from their own tables). */
export class ActivityEntry extends Model<InferAttributes<ActivityEntry>, InferCreationAttributes<ActivityEntry>> {
	declare id: CreationOptional<string>;
	declare workspaceId: string;
	declare sheetId: string | null;
	declare actorId: string | null;
	declare kind: string;
	declare detail: CreationOptional<Record<string, unknown>>;
	declare createdAt: CreationOptional<Date>;
}

export function initNotification(sequelize: Sequelize) {
	Notification.init(
		{
			id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
			userId: { type: DataTypes.UUID, allowNull: false },
			kind: { type: DataTypes.STRING(24), allowNull: false },
			actorId: { type: DataTypes.UUID, allowNull: true },
			sheetId: { type: DataTypes.UUID, allowNull: true },
			detail: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
			readAt: { type: DataTypes.DATE, allowNull: true },
			createdAt: DataTypes.DATE
		},
		{ sequelize, tableName: 'notifications', updatedAt: false }
	);
	ActivityEntry.init(
		{
			id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
			workspaceId: { type: DataTypes.UUID, allowNull: false },
			sheetId: { type: DataTypes.UUID, allowNull: true },
			actorId: { type: DataTypes.UUID, allowNull: true },
			kind: { type: DataTypes.STRING(24), allowNull: false },
			detail: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
			createdAt: DataTypes.DATE
		},
		{ sequelize, tableName: 'activity', updatedAt: false }
	);
}
