// The live event log in PostgreSQL. Every app process reads the same table, so it does not matter
// which process a browser reconnects to: it asks for the events after the last id it saw.
import type { Transaction } from 'sequelize';
import { db } from '../db/connection';

export interface LiveEvent {
	id: number;
	kind: string;
	payload: Record<string, unknown>;
}

export const sheetChannel = (sheetId: string) => `sheet:${sheetId}`;
export const userChannel = (userId: string) => `user:${userId}`;

/** Append an event; a trigger announces it with pg_notify once the transaction commits. */
export async function publish(
	channel: string,
	kind: string,
	payload: Record<string, unknown>,
	transaction?: Transaction
): Promise<number> {
	const [rows] = await db().query(
		`INSERT INTO live_events (channel, kind, payload) VALUES (:channel, :kind, :payload::jsonb) RETURNING id`,
		{
			replacements: { channel, kind, payload: JSON.stringify(payload) },
			transaction
		}
	);
	return Number((rows as { id: string }[])[0].id);
}

export async function eventsAfter(
	channel: string,
	afterId: number,
	limit = 500
): Promise<LiveEvent[]> {
	const [rows] = await db().query(
		`SELECT id, kind, payload FROM live_events WHERE channel = :channel AND id > :afterId ORDER BY id LIMIT :limit`,
		{
			replacements: { channel, afterId, limit }
		}
	);
	return (rows as { id: string; kind: string; payload: Record<string, unknown> }[]).map((r) => ({
		id: Number(r.id),
		kind: r.kind,
		payload: r.payload
	}));
}

/** The newest event id on a channel (0 when none): a page passes it to its stream so nothing falls between load and connect. */
/** The newest event id on `channel`, or anywhere when no channel is named. */
export async function latestEventId(channel?: string): Promise<number> {
	const where = channel === undefined ? '' : 'WHERE channel = :channel';
	const [rows] = await db().query(`SELECT coalesce(max(id), 0) AS id FROM live_events ${where}`, {
		replacements: { channel: channel ?? null }
	});
	return Number((rows as { id: string }[])[0].id);
}

/** The oldest id still kept anywhere; a reconnect from before it may have missed pruned events. */
export async function oldestKeptId(): Promise<number> {
	const [rows] = await db().query(`SELECT coalesce(min(id), 0) AS id FROM live_events`);
	return Number((rows as { id: string }[])[0].id);
}

/** Events are only for catching up after a dropped connection; a few days is plenty. */
export async function pruneEvents(olderThanHours = 72): Promise<void> {
	await db().query(
		`DELETE FROM live_events WHERE created_at < now() - make_interval(hours => :h)`,
		{ replacements: { h: olderThanHours } }
	);
}
