/**
 * Which edges of a multigraph lie on a loop (are not bridges), in one depth-first pass
 * (Tarjan, "A note on finding the bridges of a graph", Inf. Process. Lett. 2(6), 1974).
 * Nodes are 0…n−1 with ground (−1) stored at slot n, as in UnionFind. Parallel edges are told
 * apart by their index, so two shorts across the same pair form a loop; a self-loop is a loop.
 * Replaces one union–find per port (O(m·E)) when asking, for every port, whether the other
 * shorts already join its terminals.
 */
export function edgesOnLoops(n: number, edges: readonly (readonly [number, number])[]): Uint8Array {
	const size = n + 1;
	const slot = (x: number) => (x < 0 ? n : x);
	const start = new Int32Array(size + 1);
	for (const [a, b] of edges) {
		start[slot(a) + 1]++;
		start[slot(b) + 1]++;
	}
	for (let v = 0; v < size; v++) start[v + 1] += start[v];
	const fill = start.slice(0, size);
	const to = new Int32Array(2 * edges.length);
	const via = new Int32Array(2 * edges.length);
	edges.forEach(([a, b], e) => {
		const sa = slot(a);
		const sb = slot(b);
		to[fill[sa]] = sb;
		via[fill[sa]++] = e;
		to[fill[sb]] = sa;
		via[fill[sb]++] = e;
	});

	const onLoop = new Uint8Array(edges.length).fill(1);
	const disc = new Int32Array(size).fill(-1);
	const low = new Int32Array(size);
	const parentEdge = new Int32Array(size).fill(-1);
	const parent = new Int32Array(size).fill(-1);
	const next = start.slice(0, size);
	const stack = new Int32Array(size);
	let clock = 0;
	for (let root = 0; root < size; root++) {
		if (disc[root] >= 0) continue;
		let top = 0;
		stack[top++] = root;
		disc[root] = low[root] = clock++;
		while (top > 0) {
			const v = stack[top - 1];
			if (next[v] < start[v + 1]) {
				const i = next[v]++;
				const w = to[i];
				if (via[i] === parentEdge[v]) continue;
				if (disc[w] < 0) {
					parent[w] = v;
					parentEdge[w] = via[i];
					disc[w] = low[w] = clock++;
					stack[top++] = w;
				} else if (disc[w] < low[v]) low[v] = disc[w];
				continue;
			}
			top--;
			const u = parent[v];
			if (u < 0) continue;
			if (low[v] < low[u]) low[u] = low[v];
			if (low[v] > disc[u]) onLoop[parentEdge[v]] = 0;
		}
	}
	return onLoop;
}
