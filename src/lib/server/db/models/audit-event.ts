import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
	declare id: CreationOptional<string>;
	declare type: string;
	declare actorId: string | null;
	declare workspaceId: string | null;
	declare sheetId: string | null;
	declare detail: CreationOptional<Record<string, unknown>>;
	declare ip: string | null;
	declare createdAt: CreationOptional<Date>;
}

export function initAuditEvent(sequelize: Sequelize) {
	AuditEvent.init(
		{
			id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
			type: { type: DataTypes.STRING(32), allowNull: false },
			actorId: { type: DataTypes.UUID, allowNull: true },
			workspaceId: { type: DataTypes.UUID, allowNull: true },
			sheetId: { type: DataTypes.UUID, allowNull: true },
			detail: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
			ip: { type: DataTypes.STRING(45), allowNull: true },
			createdAt: DataTypes.DATE
		},
		{ sequelize, tableName: 'audit_events', updatedAt: false }
	);
}
