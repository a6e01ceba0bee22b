// Admission control in front of a worker pool. The pool's own queue started every request's
// time limit on arrival, so time spent waiting behind other analyses counted against it and the
// message blamed the request ("took longer than 15 s"); nothing was shed either. Here:
//
// - at most `concurrency` tasks run (one per worker thread), so a task handed to the pool starts
//   at once and its time limit counts running time only;
// - the others wait in a bounded queue, one line per caller, served round-robin: a caller with
//   many requests waits behind its own, not in front of everyone else's (fair share);
// - a caller may have at most `perCaller` tasks running or waiting (429 beyond);
// - a full queue, or a wait longer than `maxWaitMs`, sheds the request with 503 + Retry-After and
//   says the server is busy — not that the request was slow;
// - background work (design jobs from the job queue: caller null) is never shed; it waits its
//   turn in the same rotation, so a long tolerance run cannot starve interactive requests.
//
// Plain TypeScript with no pool inside: the work is a function, so the tests drive it directly.
import { ApiProblem } from '../api/problem';

export interface AdmissionLimits {
	concurrency: number;
	maxQueue: number;
	perCaller: number;
	maxWaitMs: number;
}

/** A refusal, already in the API's terms (status, `code`, `retryAfterSeconds` → Retry-After). */
export class Shed extends ApiProblem {
	constructor(
		status: 429 | 503,
		message: string,
		readonly retryAfterSeconds: number,
		readonly code: 'busy' | 'fair_share'
	) {
		super(status, message, { code, retryAfterSeconds });
	}
}

interface Waiter {
	caller: string;
	start: () => void;
	fail: (e: Error) => void;
	timer: ReturnType<typeof setTimeout> | null;
	detach: () => void;
}

export interface AdmissionStats {
	running: number;
	waiting: number;
	admitted: number;
	shed: number;
	/** Smoothed running time of one task, ms. */
	averageRunMs: number;
}

const BACKGROUND = '\u0000background';

export class Admission {
	private running = 0;
	private readonly perCallerCount = new Map<string, number>();
	/** Callers with waiting tasks, in the order they are served. */
	private readonly lines = new Map<string, Waiter[]>();
	private waitingCount = 0;
	/** Who got the last slot: their line goes behind the others at the next turn. */
	private lastServed: string | null = null;
	private averageRunMs = 100;
	private admitted = 0;
	private shedCount = 0;

	constructor(
		readonly what: string,
		private readonly limits: () => AdmissionLimits
	) {}

	stats(): AdmissionStats {
		return {
			running: this.running,
			waiting: this.waitingCount,
			admitted: this.admitted,
			shed: this.shedCount,
			averageRunMs: this.averageRunMs
		};
	}

	/** Seconds until a slot is likely free for one more waiting task, at least 1. */
	retryAfterSeconds(): number {
		const { concurrency } = this.limits();
		const ahead = this.waitingCount + this.running;
		return Math.min(
			120,
			Math.max(1, Math.ceil((ahead * this.averageRunMs) / Math.max(1, concurrency) / 1000))
		);
	}

	/** Would a task start at once (a slot free and nobody waiting)? */
	hasFreeSlot(): boolean {
		return this.running < this.limits().concurrency && this.waitingCount === 0;
	}

	/**
	 * Would a request from `caller` be refused right now? Lets a route shed before it reads and
	 * checks a large body: under overload the refusals must cost the server thread next to nothing.
	 */
	refusal(caller: string | null): Shed | null {
		if (caller === null) return null;
		const limits = this.limits();
		const mine = this.perCallerCount.get(caller) ?? 0;
		if (mine >= limits.perCaller)
			return new Shed(
				429,
				`you already have ${mine} ${this.what} running or waiting (at most ${limits.perCaller} at a time); wait for them to finish`,
				this.retryAfterSeconds(),
				'fair_share'
			);
		const free = this.running < limits.concurrency && this.waitingCount === 0;
		if (!free && this.waitingCount >= limits.maxQueue)
			return new Shed(
				503,
				`the server is busy with other ${this.what}; try again in a moment`,
				this.retryAfterSeconds(),
				'busy'
			);
		return null;
	}

	/**
	 * Run `work` when a slot is free. `caller` is who asks (a user or an address); null is
	 * background work. `signal` (the request's) takes a waiting task out of line when the
	 * client goes away.
	 */
	async run<T>(caller: string | null, work: () => Promise<T>, signal?: AbortSignal): Promise<T> {
		const limits = this.limits();
		const key = caller ?? BACKGROUND;
		const refused = this.refusal(caller);
		if (refused) {
			this.shedCount++;
			throw refused;
		}
		this.perCallerCount.set(key, (this.perCallerCount.get(key) ?? 0) + 1);
		try {
			await this.admit(key, caller !== null, limits, signal);
			this.admitted++;
			const started = performance.now();
			try {
				return await work();
			} finally {
				this.averageRunMs = 0.8 * this.averageRunMs + 0.2 * (performance.now() - started);
				this.running--;
				this.next();
			}
		} finally {
			const left = (this.perCallerCount.get(key) ?? 1) - 1;
			if (left > 0) this.perCallerCount.set(key, left);
			else this.perCallerCount.delete(key);
		}
	}

	private admit(
		key: string,
		sheddable: boolean,
		limits: AdmissionLimits,
		signal?: AbortSignal
	): Promise<void> {
		if (this.running < limits.concurrency && this.waitingCount === 0) {
			this.running++;
			this.lastServed = key;
			return Promise.resolve();
		}
		return new Promise<void>((resolve, reject) => {
			const waiter: Waiter = {
				caller: key,
				start: () => {
					waiter.detach();
					resolve();
				},
				fail: (e) => {
					this.remove(waiter);
					reject(e);
				},
				timer: null,
				detach: () => {
					if (waiter.timer) clearTimeout(waiter.timer);
					signal?.removeEventListener('abort', onAbort);
				}
			};
			const onAbort = () => waiter.fail(new Error('the request was abandoned while it waited'));
			if (signal?.aborted) return reject(new Error('the request was abandoned before it started'));
			signal?.addEventListener('abort', onAbort, { once: true });
			if (sheddable) {
				waiter.timer = setTimeout(() => {
					this.shedCount++;
					waiter.fail(
						new Shed(
							503,
							`the server is busy with other ${this.what}: yours waited ${Math.round(limits.maxWaitMs / 1000)} s without starting; try again in a moment`,
							this.retryAfterSeconds(),
							'busy'
						)
					);
				}, limits.maxWaitMs);
			}
			const line = this.lines.get(key);
			if (line) line.push(waiter);
			else this.lines.set(key, [waiter]);
			this.waitingCount++;
		});
	}

	private remove(waiter: Waiter) {
		waiter.detach();
		const line = this.lines.get(waiter.caller);
		const i = line?.indexOf(waiter) ?? -1;
		if (!line || i < 0) return;
		line.splice(i, 1);
		this.waitingCount--;
		if (line.length === 0) this.lines.delete(waiter.caller);
	}

	/** Hand free slots to the next callers in rotation: the first line's first task, then that
	 * line moves to the back; the caller served last waits behind everyone else. */
	private next() {
		const { concurrency } = this.limits();
		while (this.running < concurrency && this.waitingCount > 0) {
			if (this.lines.size > 1 && this.lines.has(this.lastServed ?? '')) {
				const mine = this.lines.get(this.lastServed!)!;
				this.lines.delete(this.lastServed!);
				this.lines.set(this.lastServed!, mine);
			}
			const [key, line] = this.lines.entries().next().value as [string, Waiter[]];
			this.lastServed = key;
			const waiter = line.shift()!;
			this.lines.delete(key);
			if (line.length) this.lines.set(key, line);
			this.waitingCount--;
			this.running++;
			waiter.start();
		}
	}
}
