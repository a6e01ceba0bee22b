// What people do to sheets and their revisions, shared by the pages and the JSON API. Every verb
// starts with the access module, so a page and an API call can never disagree.
import { authorizeSheet, authorizeWorkspace, type Actor } from '../access';
import { recordAudit } from '../audit';
import {
	createSheet,
	destroySheet,
	duplicateSheet,
	getRevision,
	listRevisions,
	renameSheet,
	restoreRevision,
	restoreSheet,
	saveRevision,
	trashSheet,
	nameRevision,
	markCheckpoint,
	revisionsForHistory,
	revisionReferences,
	type SheetListQuery
} from '../db/sheets';
import { groupCheckpoints, type RevisionForHistory } from './checkpoints';
import { AccessDenied } from '../access';
import { sheetsWithReview } from './sheet-list';
import type { ListReviewFilter } from '../review/state';

type UserActor = Actor & { kind: 'user' };

/** A new sheet starts with a working first-order low-pass, so analysis has something to show. */
export const STARTER_DOCUMENT = {
	schema: 1,
	elements: [
		{ id: 'Vin', type: 'V', nodes: ['in', 'gnd'], value: 1 },
		{ id: 'R1', type: 'R', nodes: ['in', 'out'], value: '1k' },
		{ id: 'C1', type: 'C', nodes: ['out', 'gnd'], value: '1n' }
	],
	input: 'Vin',
	output: { node: 'out', reference: 'gnd' }
};

export async function listWorkspaceSheets(actor: Actor, query: SheetListQuery & { state?: ListReviewFilter }) {
	const access = await authorizeWorkspace(actor, query.workspaceId, 'list');
	return { ...(await sheetsWithReview(query)), access };
}

export async function newSheet(actor: UserActor, workspaceId: string, input: { name: string; document?: unknown; layout?: unknown }) {
	await authorizeWorkspace(actor, workspaceId, 'create_sheet');
	return createSheet({ userId: actor.id, workspaceId, name: input.name, document: input.document ?? STARTER_DOCUMENT, layout: input.layout });
}

export async function renameSheetAs(actor: UserActor, sheetId: string, name: string) {
	await authorizeSheet(actor, sheetId, 'rename');
	return renameSheet(actor.id, sheetId, name);
}

export async function duplicateSheetAs(actor: UserActor, sheetId: string, name?: string) {
	const { sheet } = await authorizeSheet(actor, sheetId, 'duplicate');
	return duplicateSheet(actor.id, sheetId, name ?? `Copy of ${sheet.name}`.slice(0, 120));
}

export async function trashSheetAs(actor: UserActor, sheetId: string) {
	await authorizeSheet(actor, sheetId, 'trash');
	return trashSheet(actor.id, sheetId);
}

export async function restoreSheetAs(actor: UserActor, sheetId: string) {
	await authorizeSheet(actor, sheetId, 'restore');
	return restoreSheet(actor.id, sheetId);
}

export async function destroySheetAs(actor: UserActor, sheetId: string, ctx: { ip?: string | null }) {
	const { sheet } = await authorizeSheet(actor, sheetId, 'delete');
	await destroySheet(sheetId);
	await recordAudit({ type: 'sheet_deleted', actorId: actor.id, workspaceId: sheet.workspaceId, detail: { sheetId, name: sheet.name }, ip: ctx.ip });
	return sheet;
}

export async function saveSheetAs(
	actor: UserActor,
	sheetId: string,
	input: { document: unknown; layout?: unknown; message?: string | null; baseRevision: number }
) {
	await authorizeSheet(actor, sheetId, 'save');
	return saveRevision(actor.id, sheetId, input, input.baseRevision);
}

export async function restoreRevisionAs(actor: UserActor, sheetId: string, number: number, baseRevision?: number) {
	const { sheet } = await authorizeSheet(actor, sheetId, 'save');
	return restoreRevision(actor.id, sheetId, number, baseRevision ?? sheet.latestRevision);
}

/** Name a revision as a checkpoint (with a message if it has none); needs the right to save. */
export async function nameRevisionAs(actor: UserActor, sheetId: string, number: number, name: string | null, message: string | null) {
	await authorizeSheet(actor, sheetId, 'save');
	if (!(await nameRevision(sheetId, number, name, message))) throw new AccessDenied(404, `Revision ${number} does not exist.`);
}

/** Mark the revision as a checkpoint (the editor's explicit save), with an optional name and message. */
export async function markCheckpointAs(actor: UserActor, sheetId: string, number: number, name: string | null, message: string | null) {
	await authorizeSheet(actor, sheetId, 'save');
	if (!(await markCheckpoint(sheetId, number, name, message))) throw new AccessDenied(404, `Revision ${number} does not exist.`);
}

/** The history grouped into checkpoints (checkpoints.ts), newest first. */
export async function checkpointsOf(sheetId: string) {
	const [revisions, refs] = await Promise.all([revisionsForHistory(sheetId), revisionReferences(sheetId)]);
	return groupCheckpoints(revisions as RevisionForHistory[], refs);
}

export async function revisionHistory(actor: Actor, sheetId: string) {
	await authorizeSheet(actor, sheetId, 'read');
	return listRevisions(sheetId);
}

/** One revision (the newest without `number`); 404 when the sheet has no such revision. */
export async function readRevision(actor: Actor, sheetId: string, number?: number, action: 'read' | 'analyze' = 'read') {
	const access = await authorizeSheet(actor, sheetId, action);
	const revision = await getRevision(sheetId, number);
	if (!revision) throw new AccessDenied(404, number ? `Revision ${number} does not exist.` : 'The sheet has no revision yet.');
	return { ...access, revision };
}
