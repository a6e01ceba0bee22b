import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** An author asks named people to look at one revision. */
export class ReviewRequest extends Model<InferAttributes<ReviewRequest>, InferCreationAttributes<ReviewRequest>> {
	declare id: CreationOptional<string>;
	declare sheetId: string;
	declare revisionNumber: number;
	declare requestedBy: string | null;
	declare message: CreationOptional<string>;
	declare dueOn: string | null;
	declare withdrawnAt: Date | null;
	declare createdAt: CreationOptional<Date>;
}

export type Decision = 'approve' | 'changes';

/** One reviewer's place on a request; decision stays null until they answer. */
export class ReviewAnswer extends Model<InferAttributes<ReviewAnswer>, InferCreationAttributes<ReviewAnswer>> {
	declare id: CreationOptional<string>;
	declare requestId: string;
	declare reviewerId: string;
	declare decision: Decision | null;
	declare summary: string | null;
	declare answeredAt: Date | null;
	declare createdAt: CreationOptional<Date>;
}

export function initReview(sequelize: Sequelize) {
	ReviewRequest.init(
		{
			id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
			sheetId: { type: DataTypes.UUID, allowNull: false },
			revisionNumber: { type: DataTypes.INTEGER, allowNull: false },
			requestedBy: { type: DataTypes.UUID, allowNull: true },
			message: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
			dueOn: { type: DataTypes.DATEONLY, allowNull: true },
			withdrawnAt: { type: DataTypes.DATE, allowNull: true },
			createdAt: DataTypes.DATE
		},
		{ sequelize, tableName: 'review_requests', updatedAt: false }
	);
	ReviewAnswer.init(
		{
			id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
			requestId: { type: DataTypes.UUID, allowNull: false },
			reviewerId: { type: DataTypes.UUID, allowNull: false },
			decision: { type: DataTypes.STRING(16), allowNull: true },
			summary: { type: DataTypes.TEXT, allowNull: true },
			answeredAt: { type: DataTypes.DATE, allowNull: true },
			createdAt: DataTypes.DATE
		},
		{ sequelize, tableName: 'review_answers', updatedAt: false }
	);
}
