// The sheet data verbs. Routes import these, never the models. Every save is a new immutable
// revision; a save must name the revision it was based on, and loses (409) when another save
// got there first.
import { Op, UniqueConstraintError, type Transaction } from 'sequelize';
import { db } from './connection';
import { models } from './models';

export class RevisionConflict extends Error {
	constructor(readonly latest: RevisionRecord) {
		super(`sheet ${latest.sheetId} has revision ${latest.number}; the save was based on an older one`);
	}
}

export interface RevisionRecord {
	id: string;
	sheetId: string;
	number: number;
	authorId: string | null;
	document: unknown;
	layout: unknown;
	message: string | null;
	createdAt: Date;
}

export interface SheetRecord {
	id: string;
	workspaceId: string;
	name: string;
	status: string;
	latestRevision: number;
	createdBy: string | null;
	updatedBy: string | null;
	trashedAt: Date | null;
	createdAt: Date;
	updatedAt: Date;
}

const plain = <T>(row: { get(options: { plain: true }): unknown }) => row.get({ plain: true }) as T;

export async function createSheet(input: {
	userId: string;
	workspaceId: string;
	name: string;
	document: unknown;
	layout?: unknown;
}): Promise<{ sheet: SheetRecord; revision: RevisionRecord }> {
	const { Sheet, SheetRevision } = models();
	return db().transaction(async (transaction) => {
		const sheet = await Sheet.create(
			{ workspaceId: input.workspaceId, name: input.name, createdBy: input.userId, updatedBy: input.userId, latestRevision: 1 },
			{ transaction }
		);
		const revision = await SheetRevision.create(
			{ sheetId: sheet.id, number: 1, authorId: input.userId, document: input.document, layout: input.layout ?? null, message: 'Created' },
			{ transaction }
		);
		return { sheet: plain<SheetRecord>(sheet), revision: plain<RevisionRecord>(revision) };
	});
}

export async function getSheet(id: string): Promise<SheetRecord | null> {
	const row = await models().Sheet.findByPk(id);
	return row ? plain<SheetRecord>(row) : null;
}

export async function listSheets(workspaceId: string, { trashed = false } = {}): Promise<SheetRecord[]> {
	const rows = await models().Sheet.findAll({
		where: { workspaceId, trashedAt: trashed ? { [Op.ne]: null } : null },
		order: [['updatedAt', 'DESC']]
	});
	return rows.map((r) => plain<SheetRecord>(r));
}

export async function getRevision(sheetId: string, number?: number, transaction?: Transaction): Promise<RevisionRecord | null> {
	const { SheetRevision } = models();
	const row = await SheetRevision.findOne({
		where: number === undefined ? { sheetId } : { sheetId, number },
		order: [['number', 'DESC']],
		transaction
	});
	return row ? plain<RevisionRecord>(row) : null;
}

export async function listRevisions(sheetId: string): Promise<Omit<RevisionRecord, 'document' | 'layout'>[]> {
	const rows = await models().SheetRevision.findAll({
		where: { sheetId },
		attributes: ['id', 'sheetId', 'number', 'authorId', 'message', 'createdAt'],
		order: [['number', 'DESC']]
	});
	return rows.map((r) => plain(r));
}

/**
 * Save a new revision on top of `baseRevision`. Two saves on the same base race for the unique
 * (sheet, number) index inside their transactions; the loser gets a RevisionConflict carrying
 * the revision that won, so nothing is overwritten silently.
 */
export async function saveRevision(
	userId: string,
	sheetId: string,
	content: { document: unknown; layout?: unknown; message?: string | null },
	baseRevision: number
): Promise<RevisionRecord> {
	const { Sheet, SheetRevision } = models();
	try {
		return await db().transaction(async (transaction) => {
			const sheet = await Sheet.findByPk(sheetId, { transaction, lock: transaction.LOCK.UPDATE });
			if (!sheet) throw new Error(`sheet ${sheetId} does not exist`);
			if (sheet.latestRevision !== baseRevision) {
				throw new RevisionConflict((await getRevision(sheetId, sheet.latestRevision, transaction))!);
			}
			const revision = await SheetRevision.create(
				{ sheetId, number: baseRevision + 1, authorId: userId, document: content.document, layout: content.layout ?? null, message: content.message ?? null },
				{ transaction }
			);
			await sheet.update({ latestRevision: baseRevision + 1, updatedBy: userId }, { transaction });
			return plain<RevisionRecord>(revision);
		});
	} catch (error) {
		if (error instanceof UniqueConstraintError) {
			throw new RevisionConflict((await getRevision(sheetId))!);
		}
		throw error;
	}
}
