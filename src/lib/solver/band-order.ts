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
	const adj: number[][] = Array.from({ length: n }, () => []);
	let before = 0;
	for (let i = 0; i < n; i++) {
		for (let j = i + 1; j < n; j++) {
			if (a[i * n + j] !== 0 || a[j * n + i] !== 0) {
				adj[i].push(j);
				adj[j].push(i);
				if (j - i > before) before = j - i;
			}
		}
	}
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
