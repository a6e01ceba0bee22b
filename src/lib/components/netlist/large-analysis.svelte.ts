// A queued analysis of a large sheet as the netlist view sees it: start it (POST
// /api/analyze/jobs), follow its progress (GET /api/design/jobs/:id, once a second), cancel it
// (POST …/cancel), and hold the answer. One instance per open sheet revision.
import type { Analysis } from '$lib/solver';

export type JobState = 'idle' | 'queued' | 'running' | 'done' | 'failed' | 'cancelled';

interface JobAnswer {
	job: {
		id: string;
		state: Exclude<JobState, 'idle'>;
		done: number;
		total: number;
		error: string | null;
		recovery: string | null;
		result?: { analysis?: Analysis } | null;
	};
}

const POLL_MS = 1000;

export class LargeAnalysis {
	state = $state<JobState>('idle');
	/** 0…100. */
	percent = $state(0);
	error = $state<string | null>(null);
	recovery = $state<string | null>(null);
	analysis = $state.raw<Analysis | null>(null);
	jobId = $state<string | null>(null);
	startedAt = $state<number | null>(null);
	#timer: ReturnType<typeof setTimeout> | null = null;
	/** Bumped by every start: an answer for an older request (a resume in flight) is dropped. */
	#generation = 0;

	constructor(
		readonly sheetId: string,
		readonly revision: number
	) {}

	get busy() {
		return this.state === 'queued' || this.state === 'running';
	}

	async start(options: { poles: number; points: number }) {
		this.stop();
		const generation = ++this.#generation;
		this.jobId = null;
		this.error = null;
		this.analysis = null;
		this.percent = 0;
		this.state = 'queued';
		this.startedAt = Date.now();
		try {
			const answer = await this.#call('/api/analyze/jobs', {
				method: 'POST',
				body: JSON.stringify({ sheetId: this.sheetId, revision: this.revision, ...options })
			});
			if (generation === this.#generation) this.#take(answer);
		} catch (e) {
			this.state = 'failed';
			this.error = (e as Error).message;
		}
	}

	/**
	 * Pick up this revision's latest queued analysis (the page was reloaded, or opened by
	 * someone else while it runs): follow it if it is still going, show it if it is done.
	 */
	async resume() {
		const generation = this.#generation;
		try {
			const res = await fetch(`/api/design/sheets/${this.sheetId}/jobs`);
			if (!res.ok) return;
			const { jobs } = (await res.json()) as {
				jobs: { id: string; kind: string; revision: number; state: JobState }[];
			};
			const mine = jobs.find((j) => j.kind === 'large-analysis' && j.revision === this.revision);
			if (!mine || mine.state === 'failed' || mine.state === 'cancelled') return;
			const answer = await this.#call(`/api/design/jobs/${mine.id}`);
			// The person pressed Analyze meanwhile: their new job is the one to follow.
			if (generation !== this.#generation || this.jobId) return;
			this.startedAt = null;
			this.#take(answer);
		} catch {
			// Nothing to resume is the same as nothing found.
		}
	}

	async cancel() {
		if (!this.jobId) return;
		try {
			this.#take(await this.#call(`/api/design/jobs/${this.jobId}/cancel`, { method: 'POST' }));
		} catch (e) {
			this.error = (e as Error).message;
		}
	}

	/** Stop following the job (the page is leaving); the job itself goes on. */
	stop() {
		if (this.#timer) clearTimeout(this.#timer);
		this.#timer = null;
	}

	#take({ job }: JobAnswer) {
		this.jobId = job.id;
		this.state = job.state;
		this.percent = job.total ? Math.round((100 * job.done) / job.total) : 0;
		this.recovery = job.recovery;
		if (job.state === 'failed') this.error = job.error ?? 'the analysis failed';
		if (job.state === 'done') {
			this.percent = 100;
			this.analysis = job.result?.analysis ?? null;
		}
		if (this.busy) this.#timer = setTimeout(() => this.#poll(), POLL_MS);
	}

	async #poll() {
		if (!this.jobId) return;
		const id = this.jobId;
		try {
			const answer = await this.#call(`/api/design/jobs/${id}`);
			if (id === this.jobId) this.#take(answer);
		} catch (e) {
			// A network blip: try again on the next tick rather than giving up on a long job.
			this.error = (e as Error).message;
			this.#timer = setTimeout(() => this.#poll(), 2 * POLL_MS);
		}
	}

	async #call(url: string, init: RequestInit = {}): Promise<JobAnswer> {
		const res = await fetch(url, {
			...init,
			headers: { 'content-type': 'application/json', ...(init.headers ?? {}) }
		});
		const body = await res.json().catch(() => ({}));
		if (!res.ok) throw new Error(body.error ?? `the server answered ${res.status}`);
		return body as JobAnswer;
	}
}
