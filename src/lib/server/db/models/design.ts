import {
	DataTypes,
	Model,
	type CreationOptional,
	type InferAttributes,
	type InferCreationAttributes,
	type Sequelize
} from 'sequelize';

/** The spec limits and tolerances one sheet keeps for its design aids. */
export class DesignSettingsRow extends Model<
	InferAttributes<DesignSettingsRow>,
	InferCreationAttributes<DesignSettingsRow>
> {
	declare sheetId: string;
	declare settings: unknown;
	declare updatedBy: string | null;
	declare createdAt: CreationOptional<Date>;
	declare updatedAt: CreationOptional<Date>;
}

export type DesignJobState = 'queued' | 'running' | 'done' | 'failed' | 'cancelled';

/** A tolerance run on one revision: what was asked, how far it got, and what it found. */
export class DesignJob extends Model<
	InferAttributes<DesignJob>,
	InferCreationAttributes<DesignJob>
> {
	declare id: CreationOptional<string>;
	declare sheetId: string;
	declare revision: number;
	declare kind: string;
	declare state: CreationOptional<DesignJobState>;
	declare request: unknown;
	declare done: CreationOptional<number>;
	declare total: number;
	declare cancelRequested: CreationOptional<boolean>;
	declare result: CreationOptional<Record<string, unknown> | null>;
	declare error: CreationOptional<string | null>;
	declare queueId: CreationOptional<string | null>;
	declare attempt: CreationOptional<number>;
	declare workerId: CreationOptional<string | null>;
	declare heartbeatAt: CreationOptional<Date | null>;
	declare recovery: CreationOptional<string | null>;
	declare createdBy: string | null;
	declare createdAt: CreationOptional<Date>;
	declare startedAt: CreationOptional<Date | null>;
	declare finishedAt: CreationOptional<Date | null>;
}

let ready = false;

/** Initialised here rather than in models/index.ts: the design aids own these two tables. */
export function initDesignModels(sequelize: Sequelize) {
	if (ready) return;
	DesignSettingsRow.init(
		{
			sheetId: { type: DataTypes.UUID, primaryKey: true },
			settings: { type: DataTypes.JSONB, allowNull: false },
			updatedBy: { type: DataTypes.UUID, allowNull: true },
			createdAt: DataTypes.DATE,
			updatedAt: DataTypes.DATE
		},
		{ sequelize, tableName: 'design_settings' }
	);
	DesignJob.init(
		{
			id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
			sheetId: { type: DataTypes.UUID, allowNull: false },
			revision: { type: DataTypes.INTEGER, allowNull: false },
			kind: { type: DataTypes.STRING(24), allowNull: false },
			state: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'queued' },
			request: { type: DataTypes.JSONB, allowNull: false },
			done: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
			total: { type: DataTypes.INTEGER, allowNull: false },
			cancelRequested: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
			result: { type: DataTypes.JSONB, allowNull: true },
			error: { type: DataTypes.TEXT, allowNull: true },
			queueId: { type: DataTypes.STRING(64), allowNull: true },
			attempt: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
			workerId: { type: DataTypes.STRING(160), allowNull: true },
			heartbeatAt: { type: DataTypes.DATE, allowNull: true },
			recovery: { type: DataTypes.TEXT, allowNull: true },
			createdBy: { type: DataTypes.UUID, allowNull: true },
			createdAt: DataTypes.DATE,
			startedAt: { type: DataTypes.DATE, allowNull: true },
			finishedAt: { type: DataTypes.DATE, allowNull: true }
		},
		{ sequelize, tableName: 'design_jobs', updatedAt: false }
	);
	ready = true;
}
