// Revision checkpoints (issue 16, item 2): the 7-part ladder that made 17 "name · time" rows.
import { describe, expect, it } from 'vitest';
import {
	changeSummary,
	groupCheckpoints,
	type RevisionForHistory,
	type ReferenceKind
} from './checkpoints';
import type { NetworkDocument } from '../../network/schema';

const el = (id: string, type: string, nodes: string[], value: string) =>
	({ id, type, nodes, value }) as NetworkDocument['elements'][number];
const doc = (...elements: NetworkDocument['elements']): NetworkDocument => ({
	schema: 1,
	elements,
	input: 'V1',
	output: { node: 'b' }
});
const V = el('V1', 'V', ['a', 'gnd'], '1');

const t0 = Date.UTC(2026, 11, 4, 13, 0, 0);
const rev = (
	number: number,
	minutes: number,
	d: NetworkDocument,
	extra: Partial<RevisionForHistory> = {}
): RevisionForHistory => ({
	number,
	authorId: 'mira',
	authorName: 'Mira Castell',
	createdAt: new Date(t0 + minutes * 60_000),
	message: null,
	name: null,
	document: d,
	...extra
});

describe('changeSummary', () => {
	it('says value changes, additions and removals in a line', () => {
		const a = doc(V, el('Ctop', 'C', ['a', 'b'], '6.8p'), el('R2', 'R', ['b', 'gnd'], '1k'));
		const b = doc(V, el('Ctop', 'C', ['a', 'b'], '6.67p'), el('R4', 'R', ['b', 'gnd'], '1M'));
		expect(changeSummary(a, b)).toBe('Ctop 6.8p → 6.67p; added R4; removed R2');
	});
	it('a save that only moved the drawing says so', () => {
		const a = doc(V, el('R1', 'R', ['a', 'b'], '1k'));
		expect(changeSummary(a, a)).toBe('drawing moved; the network is the same');
	});
	it('equal values written differently are no change (1k = 1000)', () => {
		expect(
			changeSummary(
				doc(V, el('R1', 'R', ['a', 'b'], '1k')),
				doc(V, el('R1', 'R', ['a', 'b'], '1000'))
			)
		).toBe('drawing moved; the network is the same');
	});
});

describe('groupCheckpoints', () => {
	// Drawing a ladder: 17 saves within a few minutes, one pause of 20 minutes after save 9.
	const ladder = (n: number) =>
		doc(
			V,
			...Array.from({ length: Math.min(7, n) }, (_, i) =>
				el(`R${i + 1}`, 'R', [i ? `n${i}` : 'a', `n${i + 1}`], '1k')
			)
		);
	const saves = Array.from({ length: 17 }, (_, i) =>
		rev(i + 1, i < 9 ? i * 0.5 : 25 + i * 0.5, ladder(i + 1))
	);

	it('17 saves with one pause are two checkpoints, newest first, each with its summary', () => {
		const cps = groupCheckpoints(saves, new Map());
		expect(cps.map((c) => [c.first, c.number])).toEqual([
			[10, 17],
			[1, 9]
		]);
		expect(cps[1].summary).toBe('created with 8 parts');
		expect(cps[0].revisions).toHaveLength(8);
	});

	it('a revision something points at is never folded into a group: it ends its own checkpoint', () => {
		const refs = new Map<number, Set<ReferenceKind>>([
			[4, new Set(['comment'])],
			[12, new Set(['review'])]
		]);
		const cps = groupCheckpoints(saves, refs);
		const numbers = cps.map((c) => c.number);
		expect(numbers).toContain(4);
		expect(numbers).toContain(12);
		expect(cps.find((c) => c.number === 12)!.referencedBy).toEqual(['review']);
		// Every revision is in exactly one checkpoint: nothing is lost.
		expect(cps.flatMap((c) => c.revisions.map((r) => r.number)).sort((a, b) => a - b)).toEqual(
			saves.map((s) => s.number)
		);
	});

	it('a named revision or one saved with a message ends a checkpoint; another author starts one', () => {
		const named = saves.map((s) =>
			s.number === 3
				? { ...s, name: 'first ladder' }
				: s.number === 6
					? { ...s, authorId: 'aino', authorName: 'Aino' }
					: s
		);
		const cps = groupCheckpoints(named, new Map());
		expect(cps.find((c) => c.number === 3)).toMatchObject({ first: 1, name: 'first ladder' });
		expect(cps.find((c) => c.first === 6)).toMatchObject({ number: 6, authorName: 'Aino' });
	});

	it('a revision marked from the editor (Ctrl+S) ends its checkpoint without a name or message', () => {
		const marked = saves.map((s) => (s.number === 5 ? { ...s, checkpoint: true } : s));
		const cps = groupCheckpoints(marked, new Map());
		expect(cps.map((c) => [c.first, c.number])).toEqual([
			[10, 17],
			[6, 9],
			[1, 5]
		]);
		expect(cps[2]).toMatchObject({ name: null, message: null });
	});
});
