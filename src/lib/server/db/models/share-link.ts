import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A read-only link to one sheet. Only the token's SHA-256 is kept; revoking ends it for good. */
export class ShareLink extends Model<InferAttributes<ShareLink>, InferCreationAttributes<ShareLink>> {
	declare id: CreationOptional<string>;
	declare sheetId: string;
	declare tokenHash: string;
	declare label: string | null;
	declare createdBy: string | null;
	declare revokedAt: CreationOptional<Date | null>;
	declare createdAt: CreationOptional<Date>;
}

export function initShareLink(sequelize: Sequelize) {
	ShareLink.init(
		{
			id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
			sheetId: { type: DataTypes.UUID, allowNull: false },
			tokenHash: { type: DataTypes.STRING(64), allowNull: false },
			label: { type: DataTypes.STRING(80), allowNull: true },
			createdBy: { type: DataTypes.UUID, allowNull: true },
			revokedAt: { type: DataTypes.DATE, allowNull: true },
			createdAt: DataTypes.DATE
		},
		{ sequelize, tableName: 'share_links', updatedAt: false }
	);
}
