// Admission control without a pool: work is a promise the test resolves, so every assertion is
// about order and counts, never about time (issue 14: a queued analysis's time limit ran while
// it waited, nothing was shed, and one caller could fill the queue).
import { describe, expect, it } from 'vitest';
import { Admission, Shed, type AdmissionLimits } from './admission';

function deferred() {
	let release!: () => void;
	const done = new Promise<void>((r) => (release = r));
	return { done, release };
}

/** A task that records when its work starts and finishes when released. */
function task(log: string[], name: string) {
	const gate = deferred();
	return {
		release: gate.release,
		work: async () => {
			log.push(`start ${name}`);
			await gate.done;
			return name;
		}
	};
}

const flush = () => new Promise((r) => setTimeout(r, 0));
const make = (limits: Partial<AdmissionLimits> = {}) =>
	new Admission('analyses', () => ({
		concurrency: 1,
		maxQueue: 8,
		perCaller: 8,
		maxWaitMs: 60_000,
		...limits
	}));

describe('Admission', () => {
	it('starts a waiting task’s work only when a slot is free (its time limit starts in the work)', async () => {
		const a = make();
		const log: string[] = [];
		const first = task(log, 'A');
		const second = task(log, 'B');
		const pa = a.run('alice', first.work);
		const pb = a.run('bob', second.work);
		await flush();
		expect(log).toEqual(['start A']);
		expect(a.stats()).toMatchObject({ running: 1, waiting: 1 });
		first.release();
		await expect(pa).resolves.toBe('A');
		await flush();
		expect(log).toEqual(['start A', 'start B']);
		second.release();
		await expect(pb).resolves.toBe('B');
		expect(a.stats()).toMatchObject({ running: 0, waiting: 0, admitted: 2, shed: 0 });
	});

	it('sheds with 503 “busy” and a Retry-After once the queue is full', async () => {
		const a = make({ maxQueue: 2 });
		const log: string[] = [];
		const tasks = ['A', 'B', 'C'].map((n) => task(log, n));
		const runs = tasks.map((t, i) => a.run(`caller${i}`, t.work));
		await flush();
		const refused = await a.run('caller9', task(log, 'D').work).catch((e) => e);
		expect(refused).toBeInstanceOf(Shed);
		expect(refused).toMatchObject({ status: 503, code: 'busy' });
		expect(refused.message).toMatch(/^the server is busy with other analyses/);
		expect(refused.message).not.toMatch(/took longer|slow/);
		expect(refused.retryAfterSeconds).toBeGreaterThanOrEqual(1);
		expect(log).not.toContain('start D');
		tasks.forEach((t) => t.release());
		await Promise.all(runs);
	});

	it('gives each caller a fair share: one caller cannot fill the queue, and others go first in turn', async () => {
		const a = make({ perCaller: 3 });
		const log: string[] = [];
		const greedy = ['x1', 'x2', 'x3'].map((n) => task(log, n));
		const runs = greedy.map((t) => a.run('greedy', t.work));
		await flush();
		const over = await a.run('greedy', task(log, 'x4').work).catch((e) => e);
		expect(over).toMatchObject({ status: 429, code: 'fair_share' });
		expect(over.message).toMatch(/you already have 3 analyses running or waiting/);
		// Another caller is admitted and served before the greedy caller's second and third.
		const other = task(log, 'y1');
		const py = a.run('modest', other.work);
		greedy[0].release();
		await flush();
		await flush();
		expect(log).toEqual(['start x1', 'start y1']);
		other.release();
		await py;
		await flush();
		expect(log).toEqual(['start x1', 'start y1', 'start x2']);
		greedy.slice(1).forEach((t) => t.release());
		await Promise.all(runs);
	});

	it('sheds a task that waited too long with “busy”, and never blames it for being slow', async () => {
		const a = make({ maxWaitMs: 20 });
		const log: string[] = [];
		const hog = task(log, 'hog');
		const ph = a.run('hog', hog.work);
		const waited = await a.run('victim', task(log, 'victim').work).catch((e) => e);
		expect(waited).toMatchObject({ status: 503, code: 'busy' });
		expect(waited.message).toMatch(/busy with other analyses: yours waited 0 s without starting/);
		expect(log).toEqual(['start hog']);
		expect(a.stats().waiting).toBe(0);
		hog.release();
		await ph;
	});

	it('takes a task out of line when its request goes away', async () => {
		const a = make();
		const log: string[] = [];
		const hog = task(log, 'hog');
		const ph = a.run('hog', hog.work);
		const gone = new AbortController();
		const pv = a.run('visitor', task(log, 'visitor').work, gone.signal);
		await flush();
		expect(a.stats().waiting).toBe(1);
		gone.abort();
		await expect(pv).rejects.toThrow(/abandoned/);
		expect(a.stats().waiting).toBe(0);
		hog.release();
		await ph;
		expect(log).toEqual(['start hog']);
	});

	it('never sheds background work (no caller): it waits its turn beside interactive callers', async () => {
		const a = make({ maxQueue: 0, maxWaitMs: 10, perCaller: 1 });
		const log: string[] = [];
		const hog = task(log, 'hog');
		const ph = a.run('hog', hog.work);
		const chunks = ['c1', 'c2'].map((n) => task(log, n));
		const pc = chunks.map((c) => a.run(null, c.work));
		await new Promise((r) => setTimeout(r, 30));
		hog.release();
		await ph;
		chunks[0].release();
		chunks[1].release();
		await expect(Promise.all(pc)).resolves.toEqual(['c1', 'c2']);
		expect(a.stats().shed).toBe(0);
	});

	it('frees the slot when work fails', async () => {
		const a = make();
		await expect(
			a.run('x', async () => Promise.reject(new Error('solver refused')))
		).rejects.toThrow('solver refused');
		await expect(a.run('x', async () => 'next')).resolves.toBe('next');
		expect(a.stats()).toMatchObject({ running: 0, waiting: 0 });
	});
	it('says whether a task would start at once (the sheet page skips its first analysis otherwise)', async () => {
		const a = make();
		const log: string[] = [];
		expect(a.hasFreeSlot()).toBe(true);
		const first = task(log, 'A');
		const second = task(log, 'B');
		const pa = a.run('alice', first.work);
		await flush();
		expect(a.hasFreeSlot()).toBe(false);
		const pb = a.run('bob', second.work);
		first.release();
		await pa;
		await flush();
		// B took the slot: still none free.
		expect(a.hasFreeSlot()).toBe(false);
		second.release();
		await pb;
		expect(a.hasFreeSlot()).toBe(true);
	});
});
