// Review meetings belong to a workspace: its members read them and keep them up to date (guests
// never see them: a meeting lists several sheets of the workspace).
import { AccessDenied, authorizeWorkspace, type Actor } from '../access';
import { ApiProblem } from '../api/respond';
import { getRevision, getSheet } from '../db/sheets';
import { listMembers } from '../db/workspaces';
import { recordActivity } from '../db/activity';
import { addMeetingItem, createMeeting, deleteMeeting, getMeeting, listMeetings, removeMeetingItem, updateMeeting, updateMeetingItem } from '../db/meetings';
import type { Outcome } from '../db/models/meeting';

type UserActor = Actor & { kind: 'user' };

export const OUTCOME_WORDS: Record<Outcome, string> = { accepted: 'Accepted', rework: 'Needs rework', parked: 'Held over' };

export async function meetingsOf(actor: Actor, workspaceId: string) {
	const access = await authorizeWorkspace(actor, workspaceId, 'list');
	return { access, meetings: await listMeetings(workspaceId), members: await listMembers(workspaceId) };
}

/** A meeting the caller may see; 404 for a meeting that does not exist or is in a workspace they are not in. */
export async function meetingAs(actor: Actor, meetingId: string, action: 'list' | 'create_sheet' = 'list') {
	const meeting = await getMeeting(meetingId);
	if (!meeting) throw new AccessDenied(404, 'Not found.');
	const access = await authorizeWorkspace(actor, meeting.workspaceId, action);
	return { meeting, access };
}

async function checkAttendees(workspaceId: string, ids: string[]) {
	const members = new Set((await listMembers(workspaceId)).map((m) => m.userId));
	const stranger = ids.find((id) => !members.has(id));
	if (stranger) throw new ApiProblem(400, `attendees: ${stranger} is not a member of this workspace.`);
}

export async function newMeeting(actor: UserActor, input: { workspaceId: string; title: string; heldOn: string; attendees: string[] }) {
	const access = await authorizeWorkspace(actor, input.workspaceId, 'create_sheet');
	await checkAttendees(input.workspaceId, input.attendees);
	const id = await createMeeting({ workspaceId: input.workspaceId, title: input.title, heldOn: input.heldOn, createdBy: actor.id, attendeeIds: input.attendees });
	await recordActivity({ workspaceId: access.workspace.id, sheetId: null, actorId: actor.id, kind: 'meeting', detail: { meetingId: id, title: input.title, heldOn: input.heldOn } });
	return (await getMeeting(id))!;
}

export async function changeMeeting(actor: UserActor, meetingId: string, changes: { title?: string; heldOn?: string; attendees?: string[] }) {
	const { meeting } = await meetingAs(actor, meetingId, 'create_sheet');
	if (changes.attendees) await checkAttendees(meeting.workspaceId, changes.attendees);
	await updateMeeting(meetingId, { title: changes.title, heldOn: changes.heldOn, attendeeIds: changes.attendees });
	return (await getMeeting(meetingId))!;
}

export async function dropMeeting(actor: UserActor, meetingId: string) {
	await meetingAs(actor, meetingId, 'create_sheet');
	await deleteMeeting(meetingId);
}

export async function addItem(actor: UserActor, meetingId: string, input: { sheetId: string; revision?: number }) {
	const { meeting } = await meetingAs(actor, meetingId, 'create_sheet');
	const sheet = await getSheet(input.sheetId);
	if (!sheet || sheet.workspaceId !== meeting.workspaceId) throw new ApiProblem(400, 'sheetId: no such sheet in this workspace.');
	const number = input.revision ?? sheet.latestRevision;
	if (!(await getRevision(sheet.id, number))) throw new ApiProblem(400, `revision: “${sheet.name}” has no revision ${number}.`);
	const id = await addMeetingItem(meetingId, sheet.id, number);
	return (await getMeeting(meetingId))!.items.find((i) => i.id === id)!;
}

export async function recordOutcome(actor: UserActor, meetingId: string, itemId: string, changes: { outcome?: Outcome | null; notes?: string }) {
	await meetingAs(actor, meetingId, 'create_sheet');
	if (!(await updateMeetingItem(meetingId, itemId, changes))) throw new AccessDenied(404, 'No such item in this meeting.');
	return (await getMeeting(meetingId))!.items.find((i) => i.id === itemId)!;
}

export async function dropItem(actor: UserActor, meetingId: string, itemId: string) {
	await meetingAs(actor, meetingId, 'create_sheet');
	if (!(await removeMeetingItem(meetingId, itemId))) throw new AccessDenied(404, 'No such item in this meeting.');
}
