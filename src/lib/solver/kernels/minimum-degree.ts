/**
 * Fill-reducing ordering for sparse symmetric (or symmetrized) factorization: minimum degree on
 * the quotient graph with approximate external degrees, after Amestoy, Davis and Duff, "An
 * approximate minimum degree ordering algorithm", SIAM J. Matrix Anal. Appl. 17(4), 1996 (AMD).
 *
 * Each eliminated pivot becomes an "element" standing for the clique its elimination creates, so
 * the graph never grows; a variable's degree is bounded from its own edges, the new element and
 * |Le \ Lp| of its other elements, counted in one pass over the new element's variables (the AMD
 * bound), and elements that the new one covers are absorbed. Supervariable detection and mass
 * elimination are left out: the networks served here (ladders, trees, grids, extracted meshes)
 * have few indistinguishable nodes, and the ordering's cost stays a small share of the
 * factorization's (docs/performance.md).
 *
 * Input: the symmetric adjacency (no diagonal) as `ptr`/`adj`. Output: q[new] = old.
 */
export function minimumDegreeOrder(n: number, ptr: Int32Array, adj: Int32Array): Int32Array {
	const VAR = 0;
	const ELEMENT = 1;
	const DEAD = 2;
	const state = new Uint8Array(n);
	const vars: number[][] = new Array(n);
	const elems: number[][] = new Array(n);
	const members: Int32Array[] = new Array(n);
	const deg = new Int32Array(n);
	// Degree buckets: doubly linked lists, so a degree change is O(1).
	const head = new Int32Array(n + 1).fill(-1);
	const next = new Int32Array(n).fill(-1);
	const prev = new Int32Array(n).fill(-1);
	const insert = (i: number, d: number) => {
		deg[i] = d;
		prev[i] = -1;
		next[i] = head[d];
		if (head[d] >= 0) prev[head[d]] = i;
		head[d] = i;
	};
	const remove = (i: number) => {
		if (prev[i] >= 0) next[prev[i]] = next[i];
		else head[deg[i]] = next[i];
		if (next[i] >= 0) prev[next[i]] = prev[i];
	};
	for (let i = 0; i < n; i++) {
		vars[i] = Array.from(adj.subarray(ptr[i], ptr[i + 1]));
		elems[i] = [];
		insert(i, vars[i].length);
	}
	const mark = new Int32Array(n).fill(-1);
	const wTag = new Int32Array(n).fill(-1);
	const w = new Int32Array(n);
	const order = new Int32Array(n);
	let minDeg = 0;
	const lp: number[] = [];
	for (let k = 0; k < n; k++) {
		while (head[minDeg] < 0) minDeg++;
		const p = head[minDeg];
		remove(p);
		state[p] = ELEMENT;
		order[k] = p;
		// The new element's variables: p's own neighbours and those of the elements it absorbs.
		lp.length = 0;
		mark[p] = k;
		for (const j of vars[p])
			if (state[j] === VAR && mark[j] !== k) {
				mark[j] = k;
				lp.push(j);
			}
		for (const e of elems[p]) {
			if (state[e] !== ELEMENT) continue;
			for (const i of members[e])
				if (state[i] === VAR && mark[i] !== k) {
					mark[i] = k;
					lp.push(i);
				}
			state[e] = DEAD;
			members[e] = EMPTY;
		}
		members[p] = Int32Array.from(lp);
		vars[p] = EMPTY_LIST;
		elems[p] = EMPTY_LIST;
		// Prune: edges inside the new clique are now represented by the element.
		for (const i of lp) {
			const ei = [p];
			for (const e of elems[i]) if (state[e] === ELEMENT && e !== p) ei.push(e);
			elems[i] = ei;
			const vi: number[] = [];
			for (const j of vars[i]) if (state[j] === VAR && mark[j] !== k) vi.push(j);
			vars[i] = vi;
		}
		// |Le \ Lp| for every other element touching the new one.
		for (const i of lp)
			for (const e of elems[i]) {
				if (e === p) continue;
				if (wTag[e] !== k) {
					wTag[e] = k;
					w[e] = members[e].length;
				}
				w[e]--;
			}
		const remaining = n - k - 1;
		for (const i of lp) {
			let d = vars[i].length + lp.length - 1;
			for (const e of elems[i]) {
				if (e === p || state[e] !== ELEMENT) continue;
				// Aggressive absorption: an element inside the new one adds nothing.
				if (w[e] === 0) {
					state[e] = DEAD;
					members[e] = EMPTY;
					continue;
				}
				d += w[e];
			}
			d = Math.min(d, deg[i] + lp.length, remaining - 1);
			remove(i);
			insert(i, Math.max(0, d));
			if (d < minDeg) minDeg = Math.max(0, d);
		}
	}
	return order;
}

const EMPTY = new Int32Array(0);
const EMPTY_LIST: number[] = [];
