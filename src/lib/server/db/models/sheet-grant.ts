import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { SheetRole } from './workspace';

/** A role on one sheet for one person: a member raised above the default, or a guest. */
export class SheetGrant extends Model<InferAttributes<SheetGrant>, InferCreationAttributes<SheetGrant>> {
	declare id: CreationOptional<string>;
	declare sheetId: string;
	declare userId: string;
	declare role: SheetRole;
	declare grantedBy: string | null;
	declare createdAt: CreationOptional<Date>;
	declare updatedAt: CreationOptional<Date>;
}

export function initSheetGrant(sequelize: Sequelize) {
	SheetGrant.init(
		{
			id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
			sheetId: { type: DataTypes.UUID, allowNull: false },
			userId: { type: DataTypes.UUID, allowNull: false },
			role: { type: DataTypes.STRING(16), allowNull: false },
			grantedBy: { type: DataTypes.UUID, allowNull: true },
			createdAt: DataTypes.DATE,
			updatedAt: DataTypes.DATE
		},
		{ sequelize, tableName: 'sheet_grants' }
	);
}
