// Autosave through the sheets API. Each save names the revision it started from; when someone
// else saved first the API answers 409 with their revision, and the conflict is held here until
// the person chooses: take theirs (ours is kept aside, not lost) or put ours on top of theirs.
import type { NetworkDocument } from '$lib/network/schema';

export type SaveStatus = 'saved' | 'unsaved' | 'saving' | 'conflict' | 'failed';

export interface StoredRevision {
	number: number;
	document: NetworkDocument;
	layout?: unknown;
	authorId?: string | null;
	createdAt?: string | Date;
}

interface Content {
	document: NetworkDocument;
	layout: unknown;
}

export class Autosave {
	status = $state<SaveStatus>('saved');
	baseRevision = $state(0);
	baseDocument = $state.raw<NetworkDocument | null>(null);
	conflict = $state.raw<StoredRevision | null>(null);
	message = $state<string | null>(null);
	savedAt = $state<Date | null>(null);
	#pending: Content | null = null;
	#saved = '';
	#timer: ReturnType<typeof setTimeout> | undefined;
	#inFlight = false;

	constructor(
		private readonly sheetId: string,
		private readonly delayMs = 700,
		private readonly fetcher: typeof fetch = (...a) => fetch(...a)
	) {}

	/** The content now on the server (after opening a sheet or taking theirs). */
	settle(revision: number, content: Content): void {
		this.baseRevision = revision;
		this.baseDocument = content.document;
		this.#saved = JSON.stringify(content);
		this.#pending = null;
		this.conflict = null;
		this.status = 'saved';
		this.message = null;
	}

	get dirty(): boolean {
		return (
			this.status === 'unsaved' ||
			this.status === 'saving' ||
			this.status === 'conflict' ||
			this.status === 'failed'
		);
	}

	changed(content: Content): void {
		if (this.status === 'conflict') {
			this.#pending = content; // kept for "save mine on top"
			return;
		}
		if (JSON.stringify(content) === this.#saved) {
			this.#pending = null;
			if (!this.#inFlight) this.status = 'saved';
			return;
		}
		this.#pending = content;
		this.status = this.#inFlight ? 'saving' : 'unsaved';
		clearTimeout(this.#timer);
		this.#timer = setTimeout(() => void this.flush(), this.delayMs);
	}

	async flush(): Promise<void> {
		clearTimeout(this.#timer);
		if (this.#inFlight || !this.#pending || this.status === 'conflict') return;
		const content = this.#pending;
		this.#inFlight = true;
		this.status = 'saving';
		try {
			const res = await this.fetcher(`/api/sheets/${this.sheetId}/revisions`, {
				method: 'PUT',
				headers: { 'content-type': 'application/json' },
				body: JSON.stringify({
					baseRevision: this.baseRevision,
					document: content.document,
					layout: content.layout
				})
			});
			const body = await res.json().catch(() => ({}));
			if (res.status === 409 && body?.latest) {
				this.conflict = body.latest as StoredRevision;
				this.status = 'conflict';
				return;
			}
			if (!res.ok) {
				this.status = 'failed';
				this.message = body?.error ?? `saving failed (${res.status})`;
				return;
			}
			this.baseRevision = body.revision.number;
			this.baseDocument = content.document;
			this.#saved = JSON.stringify(content);
			// eslint-disable-next-line svelte/prefer-svelte-reactivity -- replaced whole, never mutated
			this.savedAt = new Date();
			this.message = null;
			if (this.#pending === content) this.#pending = null;
			this.status = this.#pending ? 'unsaved' : 'saved';
		} catch (error) {
			this.status = 'failed';
			this.message = `saving failed: ${(error as Error).message}`;
		} finally {
			this.#inFlight = false;
			if (this.#pending && this.status === 'unsaved')
				this.#timer = setTimeout(() => void this.flush(), this.delayMs);
		}
	}

	/** Save ours as a new revision on top of theirs (theirs stays in the history). */
	async keepMine(): Promise<void> {
		const latest = this.conflict;
		if (!latest) return;
		this.conflict = null;
		this.baseRevision = latest.number;
		this.status = 'unsaved';
		await this.flush();
	}

	/** Give up the conflict and take theirs; returns our content so the page can keep it aside. */
	takeTheirs(): { theirs: StoredRevision; mine: Content | null } | null {
		const latest = this.conflict;
		if (!latest) return null;
		const mine = this.#pending;
		this.settle(latest.number, { document: latest.document, layout: latest.layout ?? null });
		return { theirs: latest, mine };
	}

	dispose(): void {
		clearTimeout(this.#timer);
	}
}
