import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class PasswordReset extends Model<InferAttributes<PasswordReset>, InferCreationAttributes<PasswordReset>> {
	/** SHA-256 hex of the token in the e-mailed link. */
	declare id: string;
	declare userId: string;
	declare expiresAt: Date;
	declare usedAt: CreationOptional<Date | null>;
	declare createdAt: CreationOptional<Date>;
}

export function initPasswordReset(sequelize: Sequelize) {
	PasswordReset.init(
		{
			id: { type: DataTypes.STRING(64), primaryKey: true },
			userId: { type: DataTypes.UUID, allowNull: false },
			expiresAt: { type: DataTypes.DATE, allowNull: false },
			usedAt: { type: DataTypes.DATE, allowNull: true },
			createdAt: DataTypes.DATE
		},
		{ sequelize, tableName: 'password_resets', updatedAt: false }
	);
}
