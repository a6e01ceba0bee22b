// One PostgreSQL LISTEN connection per app process wakes the streams of this process when any
// process publishes. The notification only says "channel X has news"; every stream then reads the
// table from its own last id, so a lost or merged notification loses nothing. A slow poll backs
// the LISTEN connection up (it reconnects by itself if the database restarts).
import pg from 'pg';
import { databaseUrl } from '../db/connection';
import { pruneEvents } from './events';

type Wake = () => void;

const POLL_MS = 5000;
const listeners = new Map<string, Set<Wake>>();
let client: pg.Client | null = null;
let connecting = false;
let timer: ReturnType<typeof setInterval> | null = null;
let lastPrune = 0;

function wake(channel: string) {
	for (const w of listeners.get(channel) ?? []) w();
}

async function connect() {
	if (client || connecting) return;
	connecting = true;
	const c = new pg.Client({ connectionString: databaseUrl() });
	try {
		await c.connect();
		c.on('notification', (n) => {
			const channel = n.payload?.split(' ')[0];
			if (channel) wake(channel);
		});
		c.on('error', () => drop(c));
		c.on('end', () => drop(c));
		await c.query('LISTEN polewise_live');
		client = c;
		// Anything published while we were not listening is picked up now.
		for (const channel of listeners.keys()) wake(channel);
	} catch {
		drop(c);
	} finally {
		connecting = false;
	}
}

function drop(c: pg.Client) {
	if (client === c) client = null;
	c.end().catch(() => undefined);
}

function tick() {
	if (listeners.size === 0) {
		if (timer) clearInterval(timer);
		timer = null;
		if (client) drop(client);
		return;
	}
	if (!client) void connect();
	for (const channel of listeners.keys()) wake(channel);
	if (Date.now() - lastPrune > 3_600_000) {
		lastPrune = Date.now();
		pruneEvents().catch(() => undefined);
	}
}

/** Call `onWake` whenever the channel may have new events; returns the unsubscribe function. */
export function subscribe(channel: string, onWake: Wake): () => void {
	(listeners.get(channel) ?? listeners.set(channel, new Set()).get(channel)!).add(onWake);
	void connect();
	timer ??= setInterval(tick, POLL_MS);
	return () => {
		const set = listeners.get(channel);
		set?.delete(onWake);
		if (set && set.size === 0) listeners.delete(channel);
	};
}
