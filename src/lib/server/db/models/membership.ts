import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export type WorkspaceRole = 'owner' | 'admin' | 'member';

export class Membership extends Model<InferAttributes<Membership>, InferCreationAttributes<Membership>> {
	declare id: CreationOptional<string>;
	declare workspaceId: string;
	declare userId: string;
	declare role: WorkspaceRole;
	declare createdAt: CreationOptional<Date>;
	declare updatedAt: CreationOptional<Date>;
}

export function initMembership(sequelize: Sequelize) {
	Membership.init(
		{
			id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
			workspaceId: { type: DataTypes.UUID, allowNull: false },
			userId: { type: DataTypes.UUID, allowNull: false },
			role: { type: DataTypes.STRING(16), allowNull: false },
			createdAt: DataTypes.DATE,
			updatedAt: DataTypes.DATE
		},
		{ sequelize, tableName: 'memberships' }
	);
}
