// Live analysis: every change posts the document to /api/analyze after a short pause; a newer
// request aborts the one in flight, so a stale answer can never overwrite a fresh one. While the
// drawing has a problem (a wrong value, no input) nothing is sent and the panels say why.
import { tick, untrack } from 'svelte';
import type { NetworkDocument } from '$lib/network/schema';
import type { Analysis } from '$lib/solver';
import type { BuildProblem } from './to-document';

export interface AnalysisFault {
	message: string;
	code?: string;
	element?: string;
	node?: string;
}

export interface AnalysisPhases {
	sent: number;
	answered: number;
	parsed: number;
	shown: number;
	painted: number;
}

/** After the next frame is painted (a task queued from a frame callback runs after its paint). */
const nextPaint = () =>
	typeof requestAnimationFrame === 'function'
		? new Promise<void>((done) => {
				requestAnimationFrame(() => setTimeout(done, 0));
				setTimeout(done, 1000); // a hidden tab paints nothing; don't wait for it
			})
		: Promise.resolve();

/** An answer computed with the page (the server's first analysis) and the body it answers. */
export interface FirstAnalysis {
	body: string;
	analysis: Analysis | { variants: VariantResult[] };
}

export type AnalysisStatus = 'idle' | 'waiting' | 'running' | 'done' | 'blocked' | 'failed';

/** Above this many ports the panels show no port-matrix tables, so the editor asks for none. */
export const PORT_TABLE_LIMIT = 12;

// The panels draw neither the input-impedance curve (only its DC value), the group delay nor the
// expansion: leaving them out of the answer cuts its JSON by about 40 %. Doublets come up to
// DOUBLET_RATIO_MAX apart, so the panel's own setting (10 % by default) filters without a new request.
export const DOUBLET_RATIO_MAX = 0.5;
export const ANALYZE_URL = `/api/analyze?points=200&stepPoints=300&omit=impedanceCurve,groupDelay,expansion&matrixPorts=${PORT_TABLE_LIMIT}&doubletRatio=${DOUBLET_RATIO_MAX}`;

/** One variant's outcome in a `variants=all` answer (docs/api.md). */
export interface VariantResult {
	name: string;
	options: string[];
	analysis: Analysis | null;
	error: { error: string; code?: string; element?: string; node?: string } | null;
}

export class LiveAnalysis {
	result = $state.raw<Analysis | null>(null);
	/** Every variant's outcome when the drawing has variants (all come in one request), else null. */
	variants = $state.raw<VariantResult[] | null>(null);
	/** The variant the panels show (`result` is its analysis); null: the first. */
	chosen = $state<string | null>(null);
	fault = $state.raw<AnalysisFault | null>(null);
	problems = $state.raw<BuildProblem[]>([]);
	status = $state<AnalysisStatus>('idle');
	/** Edit → result painted in the panels, for the last completed analysis (ms). */
	lastMs = $state<number | null>(null);
	/** The same edit's phases (ms from the edit): sent, answered, parsed, in the DOM, painted. */
	lastPhases = $state.raw<AnalysisPhases | null>(null);
	/** False while the shown result is the one the sheet opened with (no edit measured yet). */
	lastAfterEdit = $state(false);
	/** The last edit moved the drawing but left the network as it was (nothing to analyse). */
	unchangedByEdit = $state(false);
	/** The shown result is the one computed with the page (`seed`): nothing was timed here. */
	seeded = $state(false);
	/** How many requests were actually sent (tests check a bad value sends none). */
	sent = $state(0);
	/** Calls of `update` so far: the first is the document the sheet opened with. */
	#updates = 0;
	#timer: ReturnType<typeof setTimeout> | undefined;
	#controller: AbortController | null = null;
	#lastBody = '';
	#withVariants = false;

	/**
	 * `delayMs` 0 sends at once: the caller's effect already folds every change made in one
	 * update, and a newer edit aborts the request in flight, so a pause would only add latency.
	 */
	constructor(
		private readonly delayMs = 0,
		private readonly fetcher: typeof fetch = (...a) => fetch(...a)
	) {}

	/**
	 * Take an answer computed elsewhere for `body` (the server's, rendered into the page) as the
	 * current one: the same drawing is then not sent again, and the panels show it at once.
	 */
	seed(body: string, answer: Analysis | { variants: VariantResult[] }): void {
		this.#lastBody = body;
		this.status = 'done';
		this.seeded = true;
		if ('variants' in answer) {
			this.#withVariants = true;
			this.variants = answer.variants;
			this.#showChosen();
		} else {
			this.result = answer;
			this.fault = null;
		}
	}

	/** Called on every change of the drawing. */
	update(document: NetworkDocument, problems: BuildProblem[], editedAt = performance.now()): void {
		// The caller's effect must depend on the drawing only: reading `status` here would re-run
		// it (and re-send a failed network) each time an answer arrives.
		untrack(() => this.#update(document, problems, editedAt));
	}

	#update(document: NetworkDocument, problems: BuildProblem[], editedAt: number): void {
		clearTimeout(this.#timer);
		// Only the very first document is "the sheet as opened"; anything after it is an edit,
		// also when the sheet opened blocked (an empty or half-drawn sheet) and the first
		// analysis follows an edit.
		const opening = this.#updates++ === 0;
		if (problems.length) {
			this.#controller?.abort();
			this.problems = problems;
			this.status = 'blocked';
			this.#lastBody = '';
			return;
		}
		this.problems = [];
		const body = JSON.stringify(document);
		if (body === this.#lastBody && this.status !== 'failed') {
			// Moved a part: same network, nothing to analyse — but say so rather than leave an
			// older timing ("to open the sheet") standing as if it described this edit.
			if (!opening) this.unchangedByEdit = true;
			return;
		}
		this.unchangedByEdit = false;
		this.#withVariants = (document.variants?.groups.length ?? 0) > 0;
		this.status = 'waiting';
		if (this.delayMs <= 0) void this.#run(body, editedAt, opening);
		else this.#timer = setTimeout(() => this.#run(body, editedAt, opening), this.delayMs);
	}

	async #run(body: string, editedAt: number, opening: boolean): Promise<void> {
		this.#controller?.abort();
		const controller = new AbortController();
		this.#controller = controller;
		this.#lastBody = body;
		this.status = 'running';
		this.sent++;
		const sent = performance.now() - editedAt;
		try {
			const res = await this.fetcher(
				this.#withVariants ? `${ANALYZE_URL}&variants=all` : ANALYZE_URL,
				{
					method: 'POST',
					headers: { 'content-type': 'application/json' },
					body,
					signal: controller.signal
				}
			);
			const answered = performance.now() - editedAt;
			const data = await res.json();
			if (controller.signal.aborted) return;
			const parsed = performance.now() - editedAt;
			if (res.ok) {
				if (Array.isArray(data?.variants)) {
					this.variants = data.variants as VariantResult[];
					this.#showChosen();
				} else {
					this.variants = null;
					this.variantFailed = false;
					this.result = data as Analysis;
					this.fault = null;
				}
				// Measured once the panels hold the new numbers (Svelte has applied the DOM updates)
				// and again once the browser has painted them.
				await tick();
				const shown = performance.now() - editedAt;
				await nextPaint();
				if (controller.signal.aborted) return;
				const painted = performance.now() - editedAt;
				this.lastPhases = { sent, answered, parsed, shown, painted };
				this.lastMs = painted;
				this.lastAfterEdit = !opening;
				this.seeded = false;
				this.status = this.variants && this.variantFailed ? 'failed' : 'done';
			} else {
				this.fault = {
					message: data?.error ?? `the analysis answered ${res.status}`,
					code: data?.code,
					element: data?.element,
					node: data?.node
				};
				this.status = 'failed';
			}
		} catch (error) {
			if (controller.signal.aborted) return;
			this.fault = { message: `the analysis could not be reached (${(error as Error).message})` };
			this.status = 'failed';
		} finally {
			if (this.#controller === controller) this.#controller = null;
		}
	}

	/** Show another variant's analysis (no new request: all of them came in the last answer). */
	choose(name: string | null): void {
		untrack(() => {
			if (this.chosen === name) return;
			this.chosen = name;
			if (this.variants) this.#showChosen();
		});
	}

	#showChosen(): void {
		const all = this.variants ?? [];
		const v = all.find((x) => x.name === this.chosen) ?? all[0];
		if (!v) return;
		if (v.analysis) {
			this.result = v.analysis;
			this.fault = null;
		} else {
			// The panels keep the last result, marked stale, and say why this variant has none.
			const { error, ...where } = v.error ?? { error: 'no analysis' };
			this.fault = { ...where, message: `variant “${v.name}”: ${error}` };
		}
		this.variantFailed = !v.analysis;
		if (this.status === 'done' || this.status === 'failed')
			this.status = this.variantFailed ? 'failed' : 'done';
	}

	/** True while the chosen variant could not be analysed (the others may have been). */
	variantFailed = $state(false);

	dispose(): void {
		clearTimeout(this.#timer);
		this.#controller?.abort();
	}
}
