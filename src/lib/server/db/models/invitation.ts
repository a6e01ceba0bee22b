import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A pending offer to join a workspace (role admin/member) or, with sheetId, one sheet as a guest. */
export class Invitation extends Model<InferAttributes<Invitation>, InferCreationAttributes<Invitation>> {
	declare id: CreationOptional<string>;
	declare workspaceId: string;
	declare sheetId: string | null;
	declare email: string;
	declare role: string;
	declare tokenHash: string;
	declare invitedBy: string | null;
	declare expiresAt: Date;
	declare acceptedAt: CreationOptional<Date | null>;
	declare acceptedBy: CreationOptional<string | null>;
	declare revokedAt: CreationOptional<Date | null>;
	declare createdAt: CreationOptional<Date>;
}

export function initInvitation(sequelize: Sequelize) {
	Invitation.init(
		{
			id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
			workspaceId: { type: DataTypes.UUID, allowNull: false },
			sheetId: { type: DataTypes.UUID, allowNull: true },
			email: { type: DataTypes.STRING(254), allowNull: false },
			role: { type: DataTypes.STRING(16), allowNull: false },
			tokenHash: { type: DataTypes.STRING(64), allowNull: false },
			invitedBy: { type: DataTypes.UUID, allowNull: true },
			expiresAt: { type: DataTypes.DATE, allowNull: false },
			acceptedAt: { type: DataTypes.DATE, allowNull: true },
			acceptedBy: { type: DataTypes.UUID, allowNull: true },
			revokedAt: { type: DataTypes.DATE, allowNull: true },
			createdAt: DataTypes.DATE
		},
		{ sequelize, tableName: 'invitations', updatedAt: false }
	);
}
