import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export const ANCHOR_KINDS = ['sheet', 'element', 'net', 'pole', 'zero', 'time_constant', 'spec'] as const;
export type AnchorKind = (typeof ANCHOR_KINDS)[number];

/** One comment; a reply has a parent (the thread's first comment). Deleting keeps the row so a thread stays readable. */
export class Comment extends Model<InferAttributes<Comment>, InferCreationAttributes<Comment>> {
	declare id: CreationOptional<string>;
	declare sheetId: string;
	declare parentId: string | null;
	declare authorId: string | null;
	declare revisionNumber: number;
	declare anchorKind: AnchorKind;
	declare anchorRef: string | null;
	declare anchorSnapshot: unknown;
	declare body: string;
	declare bodyHtml: string;
	declare mentions: CreationOptional<string[]>;
	declare resolvedAt: Date | null;
	declare resolvedBy: string | null;
	declare editedAt: Date | null;
	declare deletedAt: Date | null;
	declare createdAt: CreationOptional<Date>;
}

export function initComment(sequelize: Sequelize) {
	Comment.init(
		{
			id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
			sheetId: { type: DataTypes.UUID, allowNull: false },
			parentId: { type: DataTypes.UUID, allowNull: true },
			authorId: { type: DataTypes.UUID, allowNull: true },
			revisionNumber: { type: DataTypes.INTEGER, allowNull: false },
			anchorKind: { type: DataTypes.STRING(16), allowNull: false },
			anchorRef: { type: DataTypes.STRING(64), allowNull: true },
			anchorSnapshot: { type: DataTypes.JSONB, allowNull: true },
			body: { type: DataTypes.TEXT, allowNull: false },
			bodyHtml: { type: DataTypes.TEXT, allowNull: false },
			mentions: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
			resolvedAt: { type: DataTypes.DATE, allowNull: true },
			resolvedBy: { type: DataTypes.UUID, allowNull: true },
			editedAt: { type: DataTypes.DATE, allowNull: true },
			deletedAt: { type: DataTypes.DATE, allowNull: true },
			createdAt: DataTypes.DATE
		},
		{ sequelize, tableName: 'comments', updatedAt: false }
	);
}
