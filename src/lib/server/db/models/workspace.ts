import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export type SheetRole = 'editor' | 'commenter' | 'viewer';

export class Workspace extends Model<InferAttributes<Workspace>, InferCreationAttributes<Workspace>> {
	declare id: CreationOptional<string>;
	declare name: string;
	declare defaultSheetRole: CreationOptional<SheetRole>;
	declare createdAt: CreationOptional<Date>;
	declare updatedAt: CreationOptional<Date>;
}

export function initWorkspace(sequelize: Sequelize) {
	Workspace.init(
		{
			id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
			name: { type: DataTypes.STRING(100), allowNull: false },
			defaultSheetRole: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'editor' },
			createdAt: DataTypes.DATE,
			updatedAt: DataTypes.DATE
		},
		{ sequelize, tableName: 'workspaces' }
	);
}
