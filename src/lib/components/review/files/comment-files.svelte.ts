// Files attached to comments, for one sheet's review panel: one list for the whole sheet
// (GET …/attachments?comment=all) grouped by comment, fetched again when the threads change.
// Kept beside the SheetReview (one per review, through a WeakMap) rather than inside it, so the
// review state stays about comments and this part can come and go on its own.
import type { SheetReview } from '../sheet-review.svelte';

export interface CommentFile {
	id: string;
	commentId: string | null;
	fileName: string;
	contentType: string;
	byteSize: number;
	createdBy: string | null;
	createdByName: string | null;
	createdAt: string;
}

/** The server's default upload limit until it tells its own; it checks again either way. */
const DEFAULT_LIMIT = 5 * 1024 * 1024;
export const ACCEPT = 'image/png,image/jpeg,image/gif,image/webp,application/pdf';

export const sizeText = (n: number) =>
	n >= 1024 * 1024
		? `${(n / 1024 / 1024).toFixed(1)} MB`
		: n >= 1024
			? `${Math.round(n / 1024)} KB`
			: `${n} B`;

export const kindText = (type: string) =>
	type === 'application/pdf' ? 'PDF' : type.replace('image/', '').toUpperCase();

export class CommentFiles {
	/** Comment id → its files; replaced whole on every change (raw state, no deep proxy). */
	byComment = $state.raw<Readonly<Record<string, CommentFile[]>>>({});
	limitBytes = $state(DEFAULT_LIMIT);
	#queued = false;

	constructor(readonly review: SheetReview) {}

	/** "5 MB", as the server words it. */
	get limitText() {
		const mb = this.limitBytes / (1024 * 1024);
		return Number.isInteger(mb) ? `${mb} MB` : `${Math.round(this.limitBytes / 1024)} KB`;
	}

	get base() {
		return `/api/sheets/${this.review.sheetId}/attachments`;
	}

	of(commentId: string): CommentFile[] {
		return this.byComment[commentId] ?? [];
	}

	/** Fetch again; every comment asks when the threads change, and one request answers all. */
	sync() {
		if (this.#queued) return;
		this.#queued = true;
		queueMicrotask(() => {
			this.#queued = false;
			void this.#load();
		});
	}

	async #load() {
		if (!this.review.sheetId) return;
		const r = await fetch(`${this.base}?comment=all`).catch(() => null);
		if (!r?.ok) return;
		const { attachments, uploadLimitBytes } = (await r.json()) as {
			attachments: CommentFile[];
			uploadLimitBytes?: number;
		};
		if (uploadLimitBytes) this.limitBytes = uploadLimitBytes;
		const next: Record<string, CommentFile[]> = {};
		for (const a of attachments) if (a.commentId) (next[a.commentId] ??= []).push(a);
		this.byComment = next;
	}

	#put(commentId: string, list: CommentFile[]) {
		this.byComment = { ...this.byComment, [commentId]: list };
	}

	/** The refusal for a file over the limit: the server would answer 413, but only after the upload. */
	tooLarge(file: File): string | null {
		return file.size > this.limitBytes
			? `“${file.name}” was not attached: the file is over the ${this.limitText} upload limit.`
			: null;
	}

	/** Attach one file to a comment; null when stored, else the reason in words (the server's). */
	async upload(commentId: string, file: File): Promise<string | null> {
		const big = this.tooLarge(file);
		if (big) return big;
		const form = new FormData();
		form.set('file', file);
		form.set('commentId', commentId);
		const r = await fetch(this.base, { method: 'POST', body: form }).catch(() => null);
		if (!r) return `“${file.name}” was not attached: the server could not be reached.`;
		const body = await r.json().catch(() => ({ error: `the server answered ${r.status}.` }));
		if (!r.ok) return `“${file.name}” was not attached: ${body.error}`;
		this.#put(commentId, [...this.of(commentId), body.attachment]);
		return null;
	}

	async remove(file: CommentFile): Promise<string | null> {
		const r = await fetch(`${this.base}/${file.id}`, { method: 'DELETE' }).catch(() => null);
		if (!r?.ok) return (await r?.json().catch(() => null))?.error ?? 'The file was not deleted.';
		if (file.commentId)
			this.#put(
				file.commentId,
				this.of(file.commentId).filter((f) => f.id !== file.id)
			);
		return null;
	}
}

const perReview = new WeakMap<SheetReview, CommentFiles>();

export function commentFilesOf(review: SheetReview): CommentFiles {
	let files = perReview.get(review);
	if (!files) perReview.set(review, (files = new CommentFiles(review)));
	return files;
}
