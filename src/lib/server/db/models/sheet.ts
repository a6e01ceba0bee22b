import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class Sheet extends Model<InferAttributes<Sheet>, InferCreationAttributes<Sheet>> {
	declare id: CreationOptional<string>;
	declare workspaceId: string;
	declare name: string;
	declare status: CreationOptional<string>;
	/** Number of the newest revision; 0 for a sheet with none yet. */
	declare latestRevision: CreationOptional<number>;
	declare createdBy: string | null;
	declare updatedBy: string | null;
	declare trashedAt: CreationOptional<Date | null>;
	declare createdAt: CreationOptional<Date>;
	declare updatedAt: CreationOptional<Date>;
}

export function initSheet(sequelize: Sequelize) {
	Sheet.init(
		{
			id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
			workspaceId: { type: DataTypes.UUID, allowNull: false },
			name: { type: DataTypes.STRING(120), allowNull: false },
			status: { type: DataTypes.STRING(24), allowNull: false, defaultValue: 'draft' },
			latestRevision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
			createdBy: { type: DataTypes.UUID, allowNull: true },
			updatedBy: { type: DataTypes.UUID, allowNull: true },
			trashedAt: { type: DataTypes.DATE, allowNull: true },
			createdAt: DataTypes.DATE,
			updatedAt: DataTypes.DATE
		},
		{ sequelize, tableName: 'sheets' }
	);
}
