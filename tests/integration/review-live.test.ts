// Live updates through the real SSE handler and PostgreSQL: events arrive as they happen (new
// comments, review answers, new revisions from the revision trigger), every event carries the
// id of its row, and a reconnect with Last-Event-ID replays exactly what was missed.
import type { RequestEvent } from '@sveltejs/kit';
import { describe, expect, it } from 'vitest';
import { useDatabase } from './support/database';
import { call } from './support/handlers';
import { matrixWorld, network } from './support/fixtures';
import { getRevision, saveRevision } from '../../src/lib/server/db/sheets';
import { db } from '../../src/lib/server/db/connection';
import * as events from '../../src/routes/api/sheets/[id=uuid]/events/+server';
import * as comments from '../../src/routes/api/sheets/[id=uuid]/comments/+server';

useDatabase();

interface Received {
	id: number;
	data: { kind: string; [k: string]: unknown };
}

/** Open the stream as `user`; `next(n)` waits for n more events; `close()` ends the connection. */
async function open(user: { id: string; email: string; name: string } | null, sheetId: string, lastEventId?: number) {
	const abort = new AbortController();
	const url = new URL(`http://127.0.0.1/api/sheets/${sheetId}/events`);
	const request = new Request(url, { signal: abort.signal, headers: lastEventId ? { 'last-event-id': String(lastEventId) } : {} });
	const response = await events.GET({ request, url, params: { id: sheetId }, locals: { user, session: null, auth: 'session' } } as unknown as RequestEvent);
	const got: Received[] = [];
	/** The id each stream says it starts from (its first frame, `event: ready`). */
	const ready: number[] = [];
	let buffer = '';
	const reader = response.body?.getReader();
	const decoder = new TextDecoder();
	const pump = (async () => {
		for (;;) {
			const chunk = await reader!.read().catch(() => ({ done: true, value: undefined }));
			if (chunk.done) return;
			buffer += decoder.decode(chunk.value);
			let end;
			while ((end = buffer.indexOf('\n\n')) >= 0) {
				const block = buffer.slice(0, end);
				buffer = buffer.slice(end + 2);
				const id = /^id: (\d+)$/m.exec(block);
				if (/^event: ready$/m.test(block)) {
					ready.push(Number(id?.[1]));
					continue;
				}
				const data = /^data: (.*)$/m.exec(block);
				if (id && data) got.push({ id: Number(id[1]), data: JSON.parse(data[1]) });
			}
		}
	})();
	return {
		response,
		got,
		ready,
		async next(count: number, timeoutMs = 8000) {
			const deadline = Date.now() + timeoutMs;
			while (got.length < count && Date.now() < deadline) await new Promise((r) => setTimeout(r, 25));
			return got;
		},
		async close() {
			abort.abort();
			await reader?.cancel().catch(() => undefined);
			await pump;
		}
	};
}

describe('live sheet events', () => {
	it('streams comments and revisions as they happen, and a reconnect replays what was missed', async () => {
		const world = await matrixWorld();
		const { sheet } = await world.sheet();
		const say = (body: string) => call(comments.POST, { user: world.commenter, params: { id: sheet.id }, method: 'POST', body: { body } });

		const first = await open(world.viewer, sheet.id);
		expect(first.response.headers.get('content-type')).toContain('text/event-stream');
		await say('one');
		const latest = (await getRevision(sheet.id))!;
		await saveRevision(world.owner.id, sheet.id, { document: network('10M') }, latest.number);
		const seen = await first.next(2);
		expect(seen.map((e) => e.data.kind)).toEqual(['comment', 'revision']);
		expect(seen[1].data).toMatchObject({ number: 2, authorId: world.owner.id });
		expect(seen[1].id).toBeGreaterThan(seen[0].id);
		await first.close();

		// While nobody listens, two more things happen.
		await say('two');
		await say('three');
		const again = await open(world.viewer, sheet.id, seen[1].id);
		const replay = await again.next(2);
		expect(replay.map((e) => e.data.kind)).toEqual(['comment', 'comment']);
		expect(replay.every((e) => e.id > seen[1].id)).toBe(true);
		// And it keeps following after the replay.
		await say('four');
		expect((await again.next(3)).map((e) => e.data.kind)).toEqual(['comment', 'comment', 'comment']);
		await again.close();

		// Without Last-Event-ID (or ?after=) a stream starts from now: nothing old is sent again.
		const fresh = await open(world.viewer, sheet.id);
		expect(await fresh.next(1, 400)).toEqual([]);
		// …and says where "now" is, so a cut before any event still resumes there: what is said
		// while it is away comes back on the next connection from that id.
		const lastSeen = again.got[again.got.length - 1].id;
		expect(fresh.ready).toHaveLength(1);
		expect(fresh.ready[0]).toBeGreaterThanOrEqual(lastSeen);
		await fresh.close();
		await say('five');
		const resumed = await open(world.viewer, sheet.id, fresh.ready[0]);
		expect((await resumed.next(1)).map((e) => e.data.kind)).toEqual(['comment']);
		expect(resumed.ready).toEqual(fresh.ready);
		await resumed.close();
	});

	it('an event written by another app process (straight into PostgreSQL) reaches this process\'s stream', async () => {
		const world = await matrixWorld();
		const { sheet } = await world.sheet();
		const stream = await open(world.viewer, sheet.id);
		// No in-memory call at all: only the table and its pg_notify trigger connect the two.
		await db().query(`INSERT INTO live_events (channel, kind, payload) VALUES (:channel, 'review', '{"action":"answered"}')`, { replacements: { channel: `sheet:${sheet.id}` } });
		const started = Date.now();
		const [event] = await stream.next(1);
		expect(event.data).toEqual({ kind: 'review', action: 'answered' });
		// LISTEN/NOTIFY wakes the stream at once; the 5 s poll is only the safety net.
		expect(Date.now() - started).toBeLessThan(2500);
		await stream.close();
	});

	it('turns away people who cannot read the sheet, before any stream starts', async () => {
		const world = await matrixWorld();
		const { sheet } = await world.sheet();
		const stranger = await open(world.outsider, sheet.id);
		expect(stranger.response.status).toBe(404);
		const nobody = await open(null, sheet.id);
		expect(nobody.response.status).toBe(401);
	});
});
