// Data verbs for the design aids: a sheet's spec limits and tolerances, and its tolerance-run
// jobs. State changes are single conditional UPDATEs, so a cancel and a finishing worker (or
// two app processes) can never both win.
import { Op } from 'sequelize';
import { db } from './connection';
import {
	DesignJob,
	DesignSettingsRow,
	initDesignModels,
	type DesignJobState
} from './models/design';
import { designSettingsSchema, type DesignSettings } from '../../network/design-schema';

function models() {
	initDesignModels(db());
	return { DesignJob, DesignSettingsRow };
}

export interface DesignJobRecord {
	id: string;
	sheetId: string;
	/** The revision it ran on, or (source 'drawing') the revision that drawing was based on. */
	revision: number;
	/** 'drawing': it ran on a network sent with the request (unsaved edits), kept in the job. */
	source: 'drawing' | 'revision';
	kind: string;
	state: DesignJobState;
	request: unknown;
	done: number;
	total: number;
	cancelRequested: boolean;
	result: unknown;
	error: string | null;
	createdBy: string | null;
	createdAt: Date;
	startedAt: Date | null;
	finishedAt: Date | null;
}

const plain = (row: DesignJob): DesignJobRecord => {
	const { queueId, request, ...rest } = row.get({ plain: true }) as DesignJobRecord & {
		queueId: string | null;
	};
	void queueId;
	// A sent network can be a megabyte: it stays in the row for the runner, out of every answer.
	const { document, ...asked } = (request ?? {}) as { document?: unknown };
	return { ...rest, request: asked, source: document === undefined ? 'revision' : 'drawing' };
};

export async function getDesignSettings(sheetId: string): Promise<DesignSettings> {
	const row = await models().DesignSettingsRow.findByPk(sheetId);
	// Stored settings were valid when saved; parse again so defaults added later fill in.
	const parsed = designSettingsSchema.safeParse(row?.settings ?? {});
	return parsed.success ? parsed.data : designSettingsSchema.parse({});
}

export async function saveDesignSettings(
	sheetId: string,
	userId: string,
	settings: DesignSettings
): Promise<DesignSettings> {
	await models().DesignSettingsRow.upsert({ sheetId, settings, updatedBy: userId });
	return settings;
}

export async function createDesignJob(input: {
	sheetId: string;
	revision: number;
	kind: string;
	request: unknown;
	total: number;
	createdBy: string;
}): Promise<DesignJobRecord> {
	return plain(await models().DesignJob.create(input));
}

export async function setQueueId(id: string, queueId: string): Promise<void> {
	await models().DesignJob.update({ queueId }, { where: { id } });
}

export async function getDesignJob(id: string): Promise<DesignJobRecord | null> {
	const row = await models().DesignJob.findByPk(id);
	return row ? plain(row) : null;
}

export async function listDesignJobs(sheetId: string, limit = 20): Promise<DesignJobRecord[]> {
	const rows = await models().DesignJob.findAll({
		where: { sheetId },
		order: [['createdAt', 'DESC']],
		limit,
		attributes: { exclude: ['result'] }
	});
	return rows.map(plain);
}

/** Claim a queued job for running; false when it was cancelled (or already claimed). */
export async function startDesignJob(id: string): Promise<boolean> {
	const [n] = await models().DesignJob.update(
		{ state: 'running', startedAt: new Date() },
		{ where: { id, state: { [Op.in]: ['queued', 'running'] }, cancelRequested: false } }
	);
	return n === 1;
}

/** Record progress; returns false when a cancel has been asked for (the runner then stops). */
export async function reportProgress(id: string, done: number): Promise<boolean> {
	const [n] = await models().DesignJob.update(
		{ done },
		{ where: { id, state: 'running', cancelRequested: false } }
	);
	return n === 1;
}

export async function finishDesignJob(
	id: string,
	outcome:
		| { state: 'done'; result: Record<string, unknown> }
		| { state: 'failed'; error: string }
		| { state: 'cancelled' }
) {
	await models().DesignJob.update(
		{
			state: outcome.state,
			finishedAt: new Date(),
			...(outcome.state === 'done' ? { result: outcome.result, error: null } : {}),
			...(outcome.state === 'failed' ? { error: outcome.error } : {})
		},
		{ where: { id, state: { [Op.in]: ['queued', 'running'] } } }
	);
}

/**
 * Ask a job to stop. A queued job is cancelled at once; a running one is flagged and its
 * runner stops at the next chunk. Returns the job as it now stands.
 */
export async function cancelDesignJob(id: string): Promise<DesignJobRecord | null> {
	const { DesignJob: Job } = models();
	await Job.update(
		{ state: 'cancelled', cancelRequested: true, finishedAt: new Date() },
		{ where: { id, state: 'queued' } }
	);
	await Job.update({ cancelRequested: true }, { where: { id, state: 'running' } });
	return getDesignJob(id);
}

/** The network sent with a job (a drawing with unsaved edits), or null for a revision's job. */
export async function storedNetworkOf(id: string): Promise<unknown | null> {
	const row = await models().DesignJob.findByPk(id, { attributes: ['request'] });
	return (row?.request as { document?: unknown } | undefined)?.document ?? null;
}

export async function queueIdOf(id: string): Promise<string | null> {
	const row = await models().DesignJob.findByPk(id, { attributes: ['queueId'] });
	return row?.queueId ?? null;
}
