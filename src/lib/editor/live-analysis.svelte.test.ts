import { describe, expect, it } from 'vitest';
import { LiveAnalysis } from './live-analysis.svelte';
import type { NetworkDocument } from '$lib/network/schema';

const doc = (v: string): NetworkDocument => ({
	schema: 1,
	elements: [{ id: 'R1', type: 'R', nodes: ['a', 'gnd'], value: v }],
	input: 'V1',
	output: { node: 'a' }
});
const wait = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** A fake server: answers after `ms`, and records whether each request was aborted. */
function slowServer(ms: number) {
	const seen: { body: string; aborted: boolean }[] = [];
	const fetcher = (async (_url: string, init: RequestInit) => {
		const entry = { body: String(init.body), aborted: false };
		seen.push(entry);
		init.signal?.addEventListener('abort', () => (entry.aborted = true));
		await wait(ms);
		if (init.signal?.aborted) throw new DOMException('aborted', 'AbortError');
		return new Response(
			JSON.stringify({ poles: [], echo: JSON.parse(entry.body).elements[0].value }),
			{ status: 200 }
		);
	}) as unknown as typeof fetch;
	return { seen, fetcher };
}

describe('LiveAnalysis', () => {
	it('a newer edit aborts the request in flight; only the newest answer is shown', async () => {
		const { seen, fetcher } = slowServer(60);
		const live = new LiveAnalysis(5, fetcher);
		live.update(doc('1k'), []);
		await wait(20);
		live.update(doc('2k'), []);
		await wait(150);
		expect(seen.map((s) => s.aborted)).toEqual([true, false]);
		expect((live.result as unknown as { echo: string }).echo).toBe('2k');
		expect(live.status).toBe('done');
	});

	it('edits inside the pause are folded into one request', async () => {
		const { seen, fetcher } = slowServer(5);
		const live = new LiveAnalysis(30, fetcher);
		for (const v of ['1', '10', '10k']) live.update(doc(v), []);
		await wait(80);
		expect(seen).toHaveLength(1);
	});

	it('a drawing with a problem sends nothing and says why', async () => {
		const { seen, fetcher } = slowServer(5);
		const live = new LiveAnalysis(5, fetcher);
		live.update(doc('10pp'), [{ item: 'x', message: 'R1: bad value' }]);
		await wait(40);
		expect(seen).toHaveLength(0);
		expect(live.status).toBe('blocked');
		expect(live.problems[0].message).toMatch(/R1/);
	});

	it('a solver error keeps the element it names', async () => {
		const fetcher = (async () =>
			new Response(
				JSON.stringify({
					error: 'node "a" is touched only by R1',
					code: 'dangling_node',
					node: 'a'
				}),
				{ status: 422 }
			)) as unknown as typeof fetch;
		const live = new LiveAnalysis(1, fetcher);
		live.update(doc('1k'), []);
		await wait(30);
		expect(live.status).toBe('failed');
		expect(live.fault).toMatchObject({ node: 'a', code: 'dangling_node' });
	});
});

describe('LiveAnalysis without a pause', () => {
	it('sends in the same turn as the edit and records each phase of the round trip', async () => {
		const { seen, fetcher } = slowServer(5);
		const live = new LiveAnalysis(0, fetcher);
		live.update(doc('1k'), []);
		expect(seen).toHaveLength(1);
		await wait(40);
		const p = live.lastPhases!;
		expect(live.status).toBe('done');
		expect(p.sent).toBeLessThanOrEqual(p.answered);
		expect(p.answered).toBeLessThanOrEqual(p.parsed);
		expect(p.parsed).toBeLessThanOrEqual(p.shown);
		expect(live.lastMs).toBe(p.painted);
	});

	it('tells the analysis the sheet opened with from one that follows an edit', async () => {
		const { fetcher } = slowServer(1);
		const live = new LiveAnalysis(0, fetcher);
		live.update(doc('1k'), []);
		await wait(20);
		expect(live.status).toBe('done');
		expect(live.lastAfterEdit).toBe(false);
		live.update(doc('2k'), []);
		await wait(20);
		expect(live.lastAfterEdit).toBe(true);
	});

	it('after an edit it never says "to open the sheet" again (issue 16, item 7)', async () => {
		const { fetcher } = slowServer(1);
		const live = new LiveAnalysis(0, fetcher);
		// A sheet that opened blocked (half drawn): its first analysis follows an edit.
		live.update(doc('1k'), [{ message: 'place the output marker on the node to observe' }]);
		live.update(doc('1k'), []);
		await wait(20);
		expect(live.status).toBe('done');
		expect(live.lastAfterEdit).toBe(true);
		// An edit that only moves the drawing: nothing to analyse, and it is said.
		live.update(doc('1k'), []);
		expect(live.unchangedByEdit).toBe(true);
		live.update(doc('2k'), []);
		expect(live.unchangedByEdit).toBe(false);
	});
	it('an answer computed with the page is said to be so until an edit is timed', async () => {
		const { fetcher } = slowServer(1);
		const live = new LiveAnalysis(0, fetcher);
		const body = JSON.stringify(doc('1k'));
		live.seed(body, { poles: [] } as unknown as Parameters<LiveAnalysis['seed']>[1]);
		expect(live.status).toBe('done');
		expect(live.seeded).toBe(true);
		expect(live.lastMs).toBeNull();
		// The editor then reports the drawing it opened with: the same network, nothing is sent.
		live.update(doc('1k'), []);
		expect(live.sent).toBe(0);
		expect(live.seeded).toBe(true);
		live.update(doc('2k'), []);
		await wait(20);
		expect(live.seeded).toBe(false);
		expect(live.lastAfterEdit).toBe(true);
	});
});
