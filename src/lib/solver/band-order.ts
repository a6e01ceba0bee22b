/**
 * Reverse Cuthill–McKee ordering (Cuthill and McKee, 1969; reversed as George, 1971) of a dense
 * square matrix's symmetrized non-zero pattern. Modified nodal matrices put the branch unknowns
 * last, which ties the first nodes to the last rows and defeats a banded elimination even for a
 * ladder; renumbered, a ladder is tridiagonal and a grid has the width of one side.
 *
 * Returns the new order (q[new] = old), or null when it would not narrow the band.
 */
export function bandOrder(a: Float64Array, n: number): Int32Array | null {
	if (n < 8) return null;
	// One row-major pass over the pattern (reading each entry's transpose would stride the whole
	// matrix), then each vertex's neighbours sorted and de-duplicated: ascending order, as the
	// tie-breaking of the breadth-first search below expects.
	const raw: number[][] = Array.from({ length: n }, () => []);
	let before = 0;
	for (let i = 0; i < n; i++) {
		const row = i * n;
		for (let j = 0; j < n; j++) {
			if (j === i || a[row + j] === 0) continue;
			if (Math.abs(j - i) > before) before = Math.abs(j - i);
			raw[i].push(j);
			raw[j].push(i);
		}
	}
	const adj = raw.map((list) => {
		list.sort((x, y) => x - y);
		const out: number[] = [];
		for (const v of list) if (out.length === 0 || out[out.length - 1] !== v) out.push(v);
		return out;
	});
	const degree = adj.map((x) => x.length);
	const order = new Int32Array(n);
	const placed = new Uint8Array(n);
	let count = 0;
	while (count < n) {
		// Start each component at an unplaced vertex of least degree (a cheap peripheral guess).
		let start = -1;
		for (let i = 0; i < n; i++)
			if (!placed[i] && (start < 0 || degree[i] < degree[start])) start = i;
		placed[start] = 1;
		order[count++] = start;
		for (let head = count - 1; head < count; head++) {
			const next = adj[order[head]].filter((v) => !placed[v]).sort((x, y) => degree[x] - degree[y]);
			for (const v of next) {
				placed[v] = 1;
				order[count++] = v;
			}
		}
	}
	order.reverse();
	const pos = new Int32Array(n);
	for (let i = 0; i < n; i++) pos[order[i]] = i;
	let after = 0;
	for (let i = 0; i < n; i++)
		for (const j of adj[i]) after = Math.max(after, Math.abs(pos[i] - pos[j]));
	return after < before ? order : null;
}
