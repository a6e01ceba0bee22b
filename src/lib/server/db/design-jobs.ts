// Data verbs for the design aids: a sheet's spec limits and tolerances, and its tolerance-run
// jobs. A job's state changes go through the shared runner's verbs (job-rows.ts): single
// conditional UPDATEs, so a cancel, a finishing worker and a take-over can never both win.
import { QueryTypes } from 'sequelize';
import { db } from './connection';
import { config } from '../config';
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
	/** 1 for the first start; more after the job was taken over from a worker that stopped. */
	attempt: number;
	/** Starts allowed before a job whose workers keep stopping is marked failed. */
	maxAttempts: number;
	/** What happened on the way, for people: "attempt 1 stopped (its process ended) at …". */
	recovery: string | null;
	/** When its worker last said it is working on it (running), or when it was queued again. */
	heartbeatAt: Date | null;
	/** Running, but no sign of life from its worker for two heartbeats or more. */
	stale: boolean;
	createdBy: string | null;
	createdAt: Date;
	startedAt: Date | null;
	finishedAt: Date | null;
}

const plain = (row: DesignJob): DesignJobRecord => {
	const { queueId, workerId, request, ...rest } = row.get({ plain: true }) as DesignJobRecord & {
		queueId: string | null;
		workerId: string | null;
	};
	// Which machine and process runs it is for the operators' logs, not for the API.
	void queueId;
	void workerId;
	const { jobStaleSeconds, jobMaxAttempts } = config();
	// Heartbeats come every sixth of the stale time; two missed ones are worth saying.
	const silentMs = rest.heartbeatAt ? Date.now() - new Date(rest.heartbeatAt).getTime() : 0;
	const stale = rest.state === 'running' && silentMs > (jobStaleSeconds * 1000) / 3;
	// A sent network can be a megabyte: it stays in the row for the runner, out of every answer.
	const { document, ...asked } = (request ?? {}) as { document?: unknown };
	return {
		...rest,
		request: asked,
		source: document === undefined ? 'revision' : 'drawing',
		maxAttempts: jobMaxAttempts,
		stale
	};
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

/** The network sent with a job (a drawing with unsaved edits), or null for a revision's job. */
export async function storedNetworkOf(id: string): Promise<unknown | null> {
	const row = await models().DesignJob.findByPk(id, { attributes: ['request'] });
	return (row?.request as { document?: unknown } | undefined)?.document ?? null;
}

export async function queueIdOf(id: string): Promise<string | null> {
	const row = await models().DesignJob.findByPk(id, { attributes: ['queueId'] });
	return row?.queueId ?? null;
}

/**
 * Runs a job has finished so far (saved chunk by chunk), in order and without gaps; a worker
 * that takes the job over continues after them.
 */
export async function savedRuns<T>(id: string): Promise<T[]> {
	const parts = await db().query<{ first: number; count: number; records: T[] }>(
		`SELECT first, count, records FROM design_job_parts WHERE job_id = :id ORDER BY first`,
		{ replacements: { id }, type: QueryTypes.SELECT }
	);
	const runs: T[] = [];
	for (const part of parts) {
		if (part.first !== runs.length) break;
		runs.push(...part.records);
	}
	return runs;
}

/**
 * Save one finished chunk of a running job. Runs are reproducible from (seed, run number), so a
 * chunk written twice (a worker presumed dead that was only slow) is the same chunk: the first
 * copy stays. Nothing is written once the job has ended.
 */
export async function saveRuns(id: string, first: number, records: unknown[]): Promise<void> {
	await db().query(
		`INSERT INTO design_job_parts (job_id, first, count, records, created_at)
		SELECT :id, :first, :count, CAST(:records AS jsonb), now()
		WHERE EXISTS (SELECT 1 FROM design_jobs WHERE id = :id AND state = 'running')
		ON CONFLICT DO NOTHING`,
		{ replacements: { id, first, count: records.length, records: JSON.stringify(records) } }
	);
}
