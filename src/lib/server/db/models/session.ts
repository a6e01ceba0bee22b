import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class Session extends Model<InferAttributes<Session>, InferCreationAttributes<Session>> {
	declare id: string;
	declare userId: string;
	declare expiresAt: Date;
	declare createdAt: CreationOptional<Date>;
}

export function initSession(sequelize: Sequelize) {
	Session.init(
		{
			id: { type: DataTypes.STRING(64), primaryKey: true },
			userId: { type: DataTypes.UUID, allowNull: false },
			expiresAt: { type: DataTypes.DATE, allowNull: false },
			createdAt: DataTypes.DATE
		},
		{ sequelize, tableName: 'sessions', updatedAt: false }
	);
}
