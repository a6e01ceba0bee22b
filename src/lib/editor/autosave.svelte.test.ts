import { describe, expect, it } from 'vitest';
import { Autosave } from './autosave.svelte';
import { describeChanges } from './document-diff';
import type { NetworkDocument } from '$lib/network/schema';

const doc = (v: string, extra: NetworkDocument['elements'] = []): NetworkDocument => ({
	schema: 1,
	elements: [
		{ id: 'V1', type: 'V', nodes: ['a', 'gnd'], value: 1 },
		{ id: 'R1', type: 'R', nodes: ['a', 'gnd'], value: v },
		...extra
	],
	input: 'V1',
	output: { node: 'a' }
});
const wait = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** A fake revisions endpoint with the API's rules: 201 on the latest base, 409 with `latest` otherwise. */
function server(start: number) {
	let latest = { number: start, document: doc('1k') as NetworkDocument, layout: null as unknown };
	const bodies: { baseRevision: number }[] = [];
	const fetcher = (async (_u: string, init: RequestInit) => {
		const b = JSON.parse(String(init.body));
		bodies.push(b);
		if (b.baseRevision !== latest.number)
			return new Response(JSON.stringify({ error: 'stale', latest }), { status: 409 });
		latest = { number: latest.number + 1, document: b.document, layout: b.layout };
		return new Response(JSON.stringify({ revision: latest }), { status: 201 });
	}) as unknown as typeof fetch;
	return {
		fetcher,
		bodies,
		get latest() {
			return latest;
		},
		set latest(l) {
			latest = l;
		}
	};
}

describe('Autosave', () => {
	it('saves after a pause on top of the revision it knows, then knows the new one', async () => {
		const s = server(3);
		const a = new Autosave('x', 10, s.fetcher);
		a.settle(3, { document: doc('1k'), layout: null });
		a.changed({ document: doc('2k'), layout: null });
		expect(a.status).toBe('unsaved');
		await wait(60);
		expect(a.status).toBe('saved');
		expect(a.baseRevision).toBe(4);
		expect(s.bodies.map((b) => b.baseRevision)).toEqual([3]);
	});

	it('the same content as saved is not saved again', async () => {
		const s = server(1);
		const a = new Autosave('x', 5, s.fetcher);
		a.settle(1, { document: doc('1k'), layout: null });
		a.changed({ document: doc('1k'), layout: null });
		await wait(30);
		expect(s.bodies).toHaveLength(0);
	});

	it('a stale base gives a conflict; keeping mine saves on top of theirs and loses nothing', async () => {
		const s = server(1);
		const a = new Autosave('x', 5, s.fetcher);
		a.settle(1, { document: doc('1k'), layout: null });
		s.latest = {
			number: 2,
			document: doc('1k', [{ id: 'C1', type: 'C', nodes: ['a', 'gnd'], value: '1n' }]),
			layout: null
		};
		a.changed({ document: doc('4.7k'), layout: null });
		await wait(40);
		expect(a.status).toBe('conflict');
		expect(describeChanges(a.baseDocument!, a.conflict!.document)).toEqual(['added C1 (C, 1n)']);
		await a.keepMine();
		expect(a.status).toBe('saved');
		expect(a.baseRevision).toBe(3);
		expect(s.latest.document.elements.find((e) => e.id === 'R1')!.value).toBe('4.7k');
	});

	it('taking theirs hands back my version so it can be kept aside', async () => {
		const s = server(1);
		const a = new Autosave('x', 5, s.fetcher);
		a.settle(1, { document: doc('1k'), layout: null });
		s.latest = { number: 2, document: doc('2.2k'), layout: null };
		a.changed({ document: doc('3.3k'), layout: null });
		await wait(40);
		const r = a.takeTheirs()!;
		expect(r.theirs.number).toBe(2);
		expect(r.mine!.document.elements[1].value).toBe('3.3k');
		expect(a.status).toBe('saved');
		expect(a.baseRevision).toBe(2);
	});
});

describe('describeChanges', () => {
	it('names value changes, rewiring and removals', () => {
		const base = doc('1k', [{ id: 'C1', type: 'C', nodes: ['a', 'gnd'], value: '1n' }]);
		const theirs = doc('1.5k');
		theirs.elements[1] = { ...theirs.elements[1], nodes: ['a', 'b'] };
		expect(describeChanges(base, theirs)).toEqual([
			'R1: value 1k → 1.5k',
			'R1: wiring changed',
			'removed C1'
		]);
	});
	it('a drawing-only change says so', () => {
		expect(describeChanges(doc('1k'), doc('1k'))).toEqual([
			'moved parts on the canvas (the network itself is the same)'
		]);
	});
});
