import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** An immutable snapshot of a sheet: the network document plus where things sit on the canvas. */
export class SheetRevision extends Model<InferAttributes<SheetRevision>, InferCreationAttributes<SheetRevision>> {
	declare id: CreationOptional<string>;
	declare sheetId: string;
	declare number: number;
	declare authorId: string | null;
	declare document: unknown;
	declare layout: unknown;
	declare message: string | null;
	/** A person's label for the revision (a checkpoint); migration 0010. */
	declare name: CreationOptional<string | null>;
	/** Marked as a checkpoint by a person (Ctrl+S in the editor); migration 0011. */
	declare checkpoint: CreationOptional<boolean>;
	declare createdAt: CreationOptional<Date>;
}

export function initSheetRevision(sequelize: Sequelize) {
	SheetRevision.init(
		{
			id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
			sheetId: { type: DataTypes.UUID, allowNull: false },
			number: { type: DataTypes.INTEGER, allowNull: false },
			authorId: { type: DataTypes.UUID, allowNull: true },
			document: { type: DataTypes.JSONB, allowNull: false },
			layout: { type: DataTypes.JSONB, allowNull: true },
			message: { type: DataTypes.STRING(200), allowNull: true },
			name: { type: DataTypes.STRING(80), allowNull: true },
			checkpoint: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
			createdAt: DataTypes.DATE
		},
		{ sequelize, tableName: 'sheet_revisions', updatedAt: false }
	);
}
