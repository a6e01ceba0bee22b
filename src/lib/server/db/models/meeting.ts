import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export const OUTCOMES = ['accepted', 'rework', 'parked'] as const;
export type Outcome = (typeof OUTCOMES)[number];

/** An internal design review: a named, dated gathering of sheet revisions. */
export class Meeting extends Model<InferAttributes<Meeting>, InferCreationAttributes<Meeting>> {
	declare id: CreationOptional<string>;
	declare workspaceId: string;
	declare title: string;
	declare heldOn: string;
	declare createdBy: string | null;
	declare createdAt: CreationOptional<Date>;
}

export class MeetingAttendee extends Model<InferAttributes<MeetingAttendee>, InferCreationAttributes<MeetingAttendee>> {
	declare meetingId: string;
	declare userId: string;
}

/** One sheet revision on the agenda, with what the meeting decided about it. */
export class MeetingItem extends Model<InferAttributes<MeetingItem>, InferCreationAttributes<MeetingItem>> {
	declare id: CreationOptional<string>;
	declare meetingId: string;
	declare position: number;
	declare sheetId: string;
	declare revisionNumber: number;
	declare outcome: Outcome | null;
	declare notes: CreationOptional<string>;
	declare createdAt: CreationOptional<Date>;
}

export function initMeeting(sequelize: Sequelize) {
	Meeting.init(
		{
			id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
			workspaceId: { type: DataTypes.UUID, allowNull: false },
			title: { type: DataTypes.STRING(120), allowNull: false },
			heldOn: { type: DataTypes.DATEONLY, allowNull: false },
			createdBy: { type: DataTypes.UUID, allowNull: true },
			createdAt: DataTypes.DATE
		},
		{ sequelize, tableName: 'meetings', updatedAt: false }
	);
	MeetingAttendee.init(
		{
			meetingId: { type: DataTypes.UUID, primaryKey: true },
			userId: { type: DataTypes.UUID, primaryKey: true }
		},
		{ sequelize, tableName: 'meeting_attendees', timestamps: false }
	);
	MeetingItem.init(
		{
			id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
			meetingId: { type: DataTypes.UUID, allowNull: false },
			position: { type: DataTypes.INTEGER, allowNull: false },
			sheetId: { type: DataTypes.UUID, allowNull: false },
			revisionNumber: { type: DataTypes.INTEGER, allowNull: false },
			outcome: { type: DataTypes.STRING(16), allowNull: true },
			notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
			createdAt: DataTypes.DATE
		},
		{ sequelize, tableName: 'meeting_items', updatedAt: false }
	);
}
