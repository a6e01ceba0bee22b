import { describe, expect, test } from 'vitest';
import { edgesOnLoops } from '../../../src/lib/solver/loop-edges';
import { UnionFind } from '../../../src/lib/solver/union-find';

/** The definition itself: edge k lies on a loop when the other edges already join its ends. */
function bruteForce(n: number, edges: [number, number][]): number[] {
	return edges.map((_, k) => {
		const uf = new UnionFind(n);
		edges.forEach(([a, b], j) => j !== k && uf.union(a, b));
		return uf.connected(edges[k][0], edges[k][1]) ? 1 : 0;
	});
}

function rng(seed: number) {
	let s = seed >>> 0;
	return () => ((s = (s * 1664525 + 1013904223) >>> 0), s / 2 ** 32);
}

describe('edges on loops (bridge finding, Tarjan 1974) against the definition', () => {
	test('small cases by hand: a path has no loop, a triangle is all loop, parallel pair loops', () => {
		expect([...edgesOnLoops(3, [[0, 1], [1, 2], [2, -1]])]).toEqual([0, 0, 0]);
		expect([...edgesOnLoops(2, [[0, 1], [1, -1], [-1, 0]])]).toEqual([1, 1, 1]);
		expect([...edgesOnLoops(2, [[0, 1], [0, 1], [1, -1]])]).toEqual([1, 1, 0]);
		expect([...edgesOnLoops(1, [[0, 0]])]).toEqual([1]);
		expect([...edgesOnLoops(4, [])]).toEqual([]);
	});
	test('400 random multigraphs (forests, sparse and dense, with ground) agree edge by edge', () => {
		const r = rng(11);
		for (let trial = 0; trial < 400; trial++) {
			const n = 1 + Math.floor(r() * 12);
			const count = Math.floor(r() * 2.5 * n);
			const node = () => Math.floor(r() * (n + 1)) - 1;
			const edges: [number, number][] = Array.from({ length: count }, () => [node(), node()]);
			expect([...edgesOnLoops(n, edges)], JSON.stringify(edges)).toEqual(bruteForce(n, edges));
		}
	});
});
