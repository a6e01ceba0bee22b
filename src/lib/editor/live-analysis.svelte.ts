// Live analysis: every change posts the document to /api/analyze after a short pause; a newer
// request aborts the one in flight, so a stale answer can never overwrite a fresh one. While the
// drawing has a problem (a wrong value, no input) nothing is sent and the panels say why.
import type { NetworkDocument } from '$lib/network/schema';
import type { Analysis } from '$lib/solver';
import type { BuildProblem } from './to-document';

export interface AnalysisFault {
	message: string;
	code?: string;
	element?: string;
	node?: string;
}

export type AnalysisStatus = 'idle' | 'waiting' | 'running' | 'done' | 'blocked' | 'failed';

export const ANALYZE_URL = '/api/analyze?points=200&stepPoints=300';

export class LiveAnalysis {
	result = $state.raw<Analysis | null>(null);
	fault = $state.raw<AnalysisFault | null>(null);
	problems = $state.raw<BuildProblem[]>([]);
	status = $state<AnalysisStatus>('idle');
	/** Edit → result on screen, for the last completed analysis (ms). */
	lastMs = $state<number | null>(null);
	/** How many requests were actually sent (tests check a bad value sends none). */
	sent = $state(0);
	#timer: ReturnType<typeof setTimeout> | undefined;
	#controller: AbortController | null = null;
	#lastBody = '';

	constructor(
		private readonly delayMs = 16,
		private readonly fetcher: typeof fetch = (...a) => fetch(...a)
	) {}

	/** Called on every change of the drawing. */
	update(document: NetworkDocument, problems: BuildProblem[], editedAt = performance.now()): void {
		clearTimeout(this.#timer);
		if (problems.length) {
			this.#controller?.abort();
			this.problems = problems;
			this.status = 'blocked';
			this.#lastBody = '';
			return;
		}
		this.problems = [];
		const body = JSON.stringify(document);
		if (body === this.#lastBody && this.status !== 'failed') return; // moved a part: same network
		this.status = 'waiting';
		this.#timer = setTimeout(() => this.#run(body, editedAt), this.delayMs);
	}

	async #run(body: string, editedAt: number): Promise<void> {
		this.#controller?.abort();
		const controller = new AbortController();
		this.#controller = controller;
		this.#lastBody = body;
		this.status = 'running';
		this.sent++;
		try {
			const res = await this.fetcher(ANALYZE_URL, {
				method: 'POST',
				headers: { 'content-type': 'application/json' },
				body,
				signal: controller.signal
			});
			const data = await res.json();
			if (controller.signal.aborted) return;
			if (res.ok) {
				this.result = data as Analysis;
				this.fault = null;
				this.status = 'done';
				this.lastMs = performance.now() - editedAt;
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

	dispose(): void {
		clearTimeout(this.#timer);
		this.#controller?.abort();
	}
}
