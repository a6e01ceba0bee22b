import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class ApiToken extends Model<InferAttributes<ApiToken>, InferCreationAttributes<ApiToken>> {
	declare id: CreationOptional<string>;
	declare userId: string;
	declare name: string;
	/** SHA-256 hex of the whole token; the token itself is shown once and never stored. */
	declare tokenHash: string;
	declare prefix: string;
	declare lastUsedAt: CreationOptional<Date | null>;
	declare revokedAt: CreationOptional<Date | null>;
	declare createdAt: CreationOptional<Date>;
}

export function initApiToken(sequelize: Sequelize) {
	ApiToken.init(
		{
			id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
			userId: { type: DataTypes.UUID, allowNull: false },
			name: { type: DataTypes.STRING(60), allowNull: false },
			tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
			prefix: { type: DataTypes.STRING(16), allowNull: false },
			lastUsedAt: { type: DataTypes.DATE, allowNull: true },
			revokedAt: { type: DataTypes.DATE, allowNull: true },
			createdAt: DataTypes.DATE
		},
		{ sequelize, tableName: 'api_tokens', updatedAt: false }
	);
}
