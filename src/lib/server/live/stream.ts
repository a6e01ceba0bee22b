// A server-sent events response for one channel. It replays what the caller missed (after
// Last-Event-ID, or ?after= on the first connect), then follows new events. Each event's id is the
// live_events row id, so the browser's automatic reconnect resumes exactly where it stopped.
import { eventsAfter, latestEventId, oldestKeptId, type LiveEvent } from './events';
import { subscribe } from './hub';

const HEARTBEAT_MS = 20_000;
const RECHECK_MS = 60_000;

/** Where to resume: Last-Event-ID (a reconnect), else ?after= (the id the page loaded with), else null: from now on. */
export function startingId(request: Request, url: URL): number | null {
	const raw = request.headers.get('last-event-id') ?? url.searchParams.get('after');
	return raw !== null && /^\d{1,15}$/.test(raw) ? Number(raw) : null;
}

const frame = (e: LiveEvent) =>
	`id: ${e.id}\ndata: ${JSON.stringify({ kind: e.kind, ...e.payload })}\n\n`;

/**
 * `stillAllowed` is asked every minute: a person whose access was withdrawn stops receiving
 * events on an open stream too.
 */
export async function eventStream(
	channel: string,
	from: number | null,
	signal: AbortSignal,
	stillAllowed: () => Promise<boolean>
): Promise<Response> {
	const encoder = new TextEncoder();
	// Fixed before the response starts, so nothing published meanwhile can slip past. A fresh
	// stream starts at the newest id anywhere (not this channel's, which may be days old and
	// would look like a reconnect from before the pruning).
	let cursor = from ?? (await latestEventId());
	const resync = from !== null && from > 0 && from < (await oldestKeptId()) - 1;
	let busy = false;
	let again = false;
	let closed = false;
	const cleanups: (() => void)[] = [];

	const body = new ReadableStream<Uint8Array>({
		async start(controller) {
			const send = (text: string) => {
				if (!closed) controller.enqueue(encoder.encode(text));
			};
			const close = () => {
				if (closed) return;
				closed = true;
				cleanups.forEach((c) => c());
				try {
					controller.close();
				} catch {
					/* already closed by the client */
				}
			};
			// Reads are serialised so events go out once and in order however often we are woken.
			const pump = async () => {
				if (busy) return void (again = true);
				busy = true;
				try {
					do {
						again = false;
						for (
							let batch = await eventsAfter(channel, cursor);
							batch.length;
							batch = await eventsAfter(channel, cursor)
						) {
							for (const e of batch) send(frame(e));
							cursor = batch[batch.length - 1].id;
						}
					} while (again && !closed);
				} catch {
					close();
				} finally {
					busy = false;
				}
			};
			send('retry: 2000\n\n');
			// The starting point as an id, so a connection cut before any event still resumes
			// exactly here (the browser's Last-Event-ID, and the client's ?after= when it reopens).
			send(`event: ready\nid: ${cursor}\ndata: {"kind":"ready"}\n\n`);
			if (resync) send(`data: ${JSON.stringify({ kind: 'resync' })}\n\n`);
			cleanups.push(subscribe(channel, () => void pump()));
			const beat = setInterval(() => send(': still here\n\n'), HEARTBEAT_MS);
			const recheck = setInterval(() => {
				stillAllowed().then((ok) => ok || close(), close);
			}, RECHECK_MS);
			cleanups.push(
				() => clearInterval(beat),
				() => clearInterval(recheck)
			);
			signal.addEventListener('abort', close, { once: true });
			await pump();
		},
		cancel() {
			closed = true;
			cleanups.forEach((c) => c());
		}
	});
	return new Response(body, {
		headers: {
			'content-type': 'text/event-stream; charset=utf-8',
			'cache-control': 'no-store',
			connection: 'keep-alive',
			'x-accel-buffering': 'no'
		}
	});
}
