// Review meetings: a dated, named list of sheet revisions with attendees, and per item what the
// meeting decided and why.
import { db } from './connection';
import { reviewModels } from './models/review';
import type { Outcome } from './models/meeting';

export interface MeetingItemRecord {
	id: string;
	position: number;
	sheetId: string;
	sheetName: string;
	revisionNumber: number;
	outcome: Outcome | null;
	notes: string;
}

export interface MeetingRecord {
	id: string;
	workspaceId: string;
	title: string;
	heldOn: string;
	createdBy: string | null;
	attendees: { userId: string; name: string; email: string }[];
	items: MeetingItemRecord[];
}

export async function createMeeting(input: { workspaceId: string; title: string; heldOn: string; createdBy: string; attendeeIds: string[] }): Promise<string> {
	const { Meeting, MeetingAttendee } = reviewModels();
	return db().transaction(async (transaction) => {
		const m = await Meeting.create({ workspaceId: input.workspaceId, title: input.title, heldOn: input.heldOn, createdBy: input.createdBy }, { transaction });
		await MeetingAttendee.bulkCreate([...new Set(input.attendeeIds)].map((userId) => ({ meetingId: m.id, userId })), { transaction });
		return m.id;
	});
}

export async function listMeetings(workspaceId: string) {
	const [rows] = await db().query(
		`SELECT m.id, m.title, m.held_on AS "heldOn", count(i.id)::int AS items, count(i.outcome)::int AS decided
		   FROM meetings m LEFT JOIN meeting_items i ON i.meeting_id = m.id WHERE m.workspace_id = :workspaceId
		  GROUP BY m.id ORDER BY m.held_on DESC, m.created_at DESC`,
		{ replacements: { workspaceId } }
	);
	return rows as { id: string; title: string; heldOn: string; items: number; decided: number }[];
}

export async function getMeeting(id: string): Promise<MeetingRecord | null> {
	const m = await reviewModels().Meeting.findByPk(id);
	if (!m) return null;
	const [attendees] = await db().query(
		`SELECT u.id AS "userId", u.name, u.email FROM meeting_attendees a JOIN users u ON u.id = a.user_id WHERE a.meeting_id = :id ORDER BY lower(u.name)`,
		{ replacements: { id } }
	);
	const [items] = await db().query(
		`SELECT i.id, i.position, i.sheet_id AS "sheetId", s.name AS "sheetName", i.revision_number AS "revisionNumber", i.outcome, i.notes
		   FROM meeting_items i JOIN sheets s ON s.id = i.sheet_id WHERE i.meeting_id = :id ORDER BY i.position, i.created_at`,
		{ replacements: { id } }
	);
	return {
		id: m.id,
		workspaceId: m.workspaceId,
		title: m.title,
		heldOn: m.heldOn,
		createdBy: m.createdBy,
		attendees: attendees as MeetingRecord['attendees'],
		items: items as MeetingItemRecord[]
	};
}

export async function updateMeeting(id: string, changes: { title?: string; heldOn?: string; attendeeIds?: string[] }): Promise<void> {
	const { Meeting, MeetingAttendee } = reviewModels();
	await db().transaction(async (transaction) => {
		const { attendeeIds, ...fields } = changes;
		if (Object.keys(fields).length) await Meeting.update(fields, { where: { id }, transaction });
		if (attendeeIds) {
			await MeetingAttendee.destroy({ where: { meetingId: id }, transaction });
			await MeetingAttendee.bulkCreate([...new Set(attendeeIds)].map((userId) => ({ meetingId: id, userId })), { transaction });
		}
	});
}

export async function deleteMeeting(id: string): Promise<void> {
	await reviewModels().Meeting.destroy({ where: { id } });
}

export async function addMeetingItem(meetingId: string, sheetId: string, revisionNumber: number): Promise<string> {
	const { MeetingItem } = reviewModels();
	const last = (await MeetingItem.max('position', { where: { meetingId } })) as number | null;
	const item = await MeetingItem.create({ meetingId, sheetId, revisionNumber, position: (last ?? 0) + 1, outcome: null });
	return item.id;
}

export async function updateMeetingItem(meetingId: string, itemId: string, changes: { outcome?: Outcome | null; notes?: string }): Promise<boolean> {
	const [count] = await reviewModels().MeetingItem.update(changes, { where: { id: itemId, meetingId } });
	return count > 0;
}

export async function removeMeetingItem(meetingId: string, itemId: string): Promise<boolean> {
	return (await reviewModels().MeetingItem.destroy({ where: { id: itemId, meetingId } })) > 0;
}
