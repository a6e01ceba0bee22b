// The review side of one sheet in the browser: threads, review state, people to mention, the
// analysis of the latest revision (for pole/zero anchors), and the live connection that keeps
// them fresh. Every live event triggers a refetch of what it concerns, so a missed or merged
// event can never leave the panel wrong.
import type { SpecComparison } from '$lib/server/review/spec-compare';
import { getContext, setContext, untrack } from 'svelte';
import { LiveChannel } from './live-channel.svelte';
import type { ActivityItem, Anchor, CommentView, Person, ReviewOverview } from './types';

export interface ResultAnchors {
	poles: { re: number; im: number; hz: number; owners: { element: string; share: number }[] }[];
	zeros: { re: number; im: number; hz: number }[];
	elements: { id: string; type: string; reactive: boolean }[];
	nets: string[];
	/** Ports of the time-constant view (parallel capacitors are one port); absent without an analysis. */
	ports?: string[];
}

export class ApiError extends Error {}

async function api<T>(url: string, init?: RequestInit): Promise<T> {
	const res = await fetch(url, { ...init, headers: { 'content-type': 'application/json', ...(init?.headers ?? {}) } });
	if (res.status === 204) return undefined as T;
	const body = await res.json().catch(() => ({}));
	if (!res.ok) throw new ApiError(body.error ?? `The server answered ${res.status}.`);
	return body as T;
}

export class SheetReview {
	threads = $state.raw<CommentView[]>([]);
	latestRevision = $state(0);
	canComment = $state(false);
	overview = $state.raw<ReviewOverview | null>(null);
	people = $state.raw<Person[]>([]);
	activity = $state.raw<ActivityItem[]>([]);
	results = $state.raw<ResultAnchors | null>(null);
	/** A revision someone else saved while this page was open. */
	newerRevision = $state<number | null>(null);
	/** The page's spec verdicts for the revision this person is asked to review (streamed by its load). */
	answerSpec = $state.raw<Promise<SpecComparison | null> | null>(null);
	/** The comment the canvas or a result row asked to show or start. */
	focus = $state<{ anchor: Anchor } | null>(null);
	loaded = $state(false);
	live = $state.raw<LiveChannel>(new LiveChannel('', () => undefined));
	sheetId = $state('');
	openedRevision = 0;
	#timer: ReturnType<typeof setTimeout> | null = null;
	#resultsFor = 0;

	constructor(readonly me: string) {}

	get base() {
		return `/api/sheets/${this.sheetId}`;
	}

	/** Follow a sheet (again, when the page moves to another sheet or revision). */
	open(sheetId: string, openedRevision: number) {
		untrack(() => this.#open(sheetId, openedRevision));
	}

	#open(sheetId: string, openedRevision: number) {
		if (sheetId === this.sheetId && openedRevision === this.openedRevision && this.live.status !== 'off') return;
		this.stop();
		if (sheetId !== this.sheetId) [this.threads, this.overview, this.activity, this.results, this.loaded, this.#resultsFor] = [[], null, [], null, false, 0];
		this.sheetId = sheetId;
		this.openedRevision = openedRevision;
		this.newerRevision = null;
		this.live = new LiveChannel(`/api/sheets/${sheetId}/events`, (m) => this.#onEvent(m), () => this.refresh());
		this.live.start();
		void this.refresh();
		void api<{ people: Person[] }>(`${this.base}/comments/people`).then((r) => (this.people = r.people), () => undefined);
	}

	stop() {
		this.live.stop();
		if (this.#timer) clearTimeout(this.#timer);
	}

	#onEvent(m: { kind: string; number?: unknown; authorId?: unknown }) {
		if (m.kind === 'revision' && typeof m.number === 'number' && m.authorId !== this.me && m.number > this.openedRevision) this.newerRevision = m.number;
		// Several events in a burst make one refetch.
		if (this.#timer) clearTimeout(this.#timer);
		this.#timer = setTimeout(() => void this.refresh(), 120);
	}

	async refresh() {
		const [c, o, a] = await Promise.all([
			api<{ threads: CommentView[]; latestRevision: number; canComment: boolean }>(`${this.base}/comments`),
			api<ReviewOverview>(`${this.base}/reviews`),
			api<{ activity: ActivityItem[] }>(`${this.base}/reviews/activity`)
		]);
		this.threads = c.threads;
		this.latestRevision = c.latestRevision;
		this.canComment = c.canComment;
		this.overview = o;
		this.activity = a.activity;
		this.loaded = true;
		if (this.#resultsFor !== c.latestRevision) void this.#loadResults(c.latestRevision);
	}

	async #loadResults(n: number) {
		this.#resultsFor = n;
		try {
			const [{ revision }, analysis] = await Promise.all([
				api<{ revision: { document: { elements: { id: string; type: string; nodes: (string | number)[] }[] } } }>(`${this.base}/revisions/${n}`),
				api<{ analysis: ResultAnchors & { timeConstants?: { openCircuit: { element: string }[] } } }>(`${this.base}/revisions/${n}/analysis`).catch(() => null)
			]);
			const els = revision.document.elements;
			// eslint-disable-next-line svelte/prefer-svelte-reactivity -- a throwaway set for de-duplication, never state
			const nets = [...new Set(els.flatMap((e) => e.nodes.map((x) => (String(x) === '0' ? 'gnd' : String(x)))))].sort();
			this.results = {
				poles: analysis?.analysis.poles ?? [],
				zeros: analysis?.analysis.zeros ?? [],
				elements: els.map((e) => ({ id: e.id, type: e.type, reactive: e.type === 'C' || e.type === 'L' })),
				nets,
				ports: analysis?.analysis.timeConstants?.openCircuit.map((t) => t.element)
			};
		} catch {
			this.results = null;
		}
	}

	comment(input: { body: string; anchor?: Anchor; parentId?: string }) {
		return api<{ comment: CommentView }>(`${this.base}/comments`, { method: 'POST', body: JSON.stringify(input) }).then(async (r) => {
			await this.refresh();
			return r.comment;
		});
	}

	async change(id: string, patch: { body?: string; resolved?: boolean }) {
		await api(`${this.base}/comments/${id}`, { method: 'PATCH', body: JSON.stringify(patch) });
		await this.refresh();
	}

	async remove(id: string) {
		await api(`${this.base}/comments/${id}`, { method: 'DELETE' });
		await this.refresh();
	}

	async requestReview(input: { reviewers: string[]; message: string; dueOn: string | null }) {
		await api(`${this.base}/reviews`, { method: 'POST', body: JSON.stringify(input) });
		await this.refresh();
	}

	async answer(requestId: string, input: { decision: 'approve' | 'changes'; summary: string }) {
		await api(`${this.base}/reviews/${requestId}/answer`, { method: 'POST', body: JSON.stringify(input) });
		await this.refresh();
	}

	async withdraw(requestId: string) {
		await api(`${this.base}/reviews/${requestId}`, { method: 'DELETE' });
		await this.refresh();
	}

	/** Open threads per anchor key (`element:C1`, `pole:p1`…), for markers on the canvas and beside result rows. */
	get openByAnchor(): Map<string, number> {
		// eslint-disable-next-line svelte/prefer-svelte-reactivity -- rebuilt on every read from $state threads; never mutated after
		const out = new Map<string, number>();
		for (const t of this.threads) {
			if (t.resolvedAt || t.deletedAt) continue;
			const key = `${t.anchorKind}:${t.anchorRef ?? ''}`;
			out.set(key, (out.get(key) ?? 0) + 1);
		}
		return out;
	}
}

const KEY = Symbol('polewise-review');
export const setReviewContext = (r: SheetReview) => setContext(KEY, r);
/** Undefined outside a sheet page with its review panel (components then show no markers). */
export const getReviewContext = () => getContext<SheetReview | undefined>(KEY);
