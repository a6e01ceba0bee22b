// One server-sent events connection. The browser's EventSource resends Last-Event-ID by itself
// after a dropped connection; when the server refuses or is gone long enough for the browser to
// give up (readyState CLOSED), we reopen from the last id we saw, backing off up to 15 s.
export type LiveStatus = 'connecting' | 'live' | 'reconnecting' | 'off';

export interface LiveMessage {
	kind: string;
	[key: string]: unknown;
}

export class LiveChannel {
	status = $state<LiveStatus>('off');
	/** When the stream last came back after a break (and caught up), for the status line. */
	reconnectedAt = $state<number | null>(null);
	#source: EventSource | null = null;
	#lastId: string | null = null;
	#delay = 1000;
	#timer: ReturnType<typeof setTimeout> | null = null;
	#stopped = false;

	constructor(
		private readonly url: string,
		private readonly onMessage: (m: LiveMessage) => void,
		private readonly onOpen: () => void = () => undefined
	) {}

	start() {
		this.#stopped = false;
		this.#open();
	}

	#open() {
		if (this.#stopped) return;
		this.status = this.#lastId ? 'reconnecting' : 'connecting';
		const sep = this.url.includes('?') ? '&' : '?';
		const source = new EventSource(
			this.#lastId ? `${this.url}${sep}after=${this.#lastId}` : this.url
		);
		this.#source = source;
		// The server's first frame names where this stream starts: from then on a reopen resumes
		// there even if no event has arrived yet.
		source.addEventListener('ready', (e) => {
			if ((e as MessageEvent).lastEventId) this.#lastId = (e as MessageEvent).lastEventId;
		});
		source.onopen = () => {
			if (this.status === 'reconnecting') this.reconnectedAt = Date.now();
			this.status = 'live';
			this.#delay = 1000;
			this.onOpen();
		};
		source.onmessage = (e) => {
			if (e.lastEventId) this.#lastId = e.lastEventId;
			try {
				this.onMessage(JSON.parse(e.data));
			} catch {
				/* a malformed frame is skipped; the next refresh catches up */
			}
		};
		source.onerror = () => {
			if (source.readyState === EventSource.CLOSED) {
				source.close();
				this.status = 'reconnecting';
				this.#timer = setTimeout(() => this.#open(), this.#delay);
				this.#delay = Math.min(this.#delay * 2, 15_000);
			} else this.status = 'reconnecting';
		};
	}

	stop() {
		this.#stopped = true;
		if (this.#timer) clearTimeout(this.#timer);
		this.#source?.close();
		this.#source = null;
		this.status = 'off';
	}
}
