/**
 * Series–parallel reduction of a two-terminal resistive network, with element names: the
 * formula a designer writes by hand ("Rtop ∥ (Rsrc + Radc)") and its value. Kernel code: it
 * knows edges and names, not circuits (resistance-formulas.ts builds the edges).
 *
 * Rules, applied until nothing changes: edges in parallel (same two nodes) merge; a node other
 * than the terminals with exactly two edges joins them in series; a node other than the
 * terminals with one edge carries no current and its edge goes. One edge left between the
 * terminals: the network is series–parallel. Anything else left (a bridge): it is not.
 * Each rule removes an edge, so the work is about linear in the number of edges.
 */
export type SpTerm =
	{ kind: 'leaf'; name: string; value: number } | { kind: 'series' | 'parallel'; parts: SpTerm[] };

export interface SpEdge {
	a: number;
	b: number;
	term: SpTerm;
}

export type SpResult =
	| { kind: 'series-parallel'; term: SpTerm }
	| { kind: 'open' }
	| { kind: 'short' }
	| { kind: 'not-series-parallel'; left: number };

export function reduceSeriesParallel(edgesIn: SpEdge[], a: number, b: number): SpResult {
	const first = reduce(edgesIn, a, b);
	if (first.kind !== 'not-series-parallel') return first.result;
	// What is left may include parts hanging from one node only (a bridge circuit tied to the
	// rest at a single node): they carry no current. Keep the block (biconnected component)
	// that holds the terminals, as closed by a virtual edge between them, and reduce again.
	const block = blockWith(first.left, a, b);
	return block.length < first.left.length ? reduce(block, a, b).result : first.result;
}

function reduce(
	edgesIn: SpEdge[],
	a: number,
	b: number
): { kind: SpResult['kind']; result: SpResult; left: SpEdge[] } {
	const done = (result: SpResult, left: SpEdge[] = []) => ({ kind: result.kind, result, left });
	if (a === b) return done({ kind: 'short' });
	const g = new Graph();
	for (const e of edgesIn) if (e.a !== e.b) g.add(e.a, e.b, e.term); // a self-loop carries no current
	// Worklist of inner nodes whose degree may now be one or two; every step removes an edge,
	// so at most E steps run in all.
	const work = [...g.nodes()];
	while (work.length) {
		const n = work.pop()!;
		if (n === a || n === b) continue;
		const at = g.edgesAt(n);
		if (at.length === 1) {
			const other = g.remove(at[0]);
			work.push(other.a === n ? other.b : other.a);
		} else if (at.length === 2) {
			const x = g.remove(at[0]);
			const y = g.remove(at[1]);
			const u = x.a === n ? x.b : x.a;
			const v = y.a === n ? y.b : y.a;
			if (u === v)
				work.push(u); // a loop hanging from u: no current, dropped
			else g.add(u, v, combine('series', x.term, y.term));
			work.push(u, v);
		}
	}
	const live = g.live();
	const reach = reachable(live, a);
	if (!reach.has(b)) return done({ kind: 'open' });
	const between = live.filter((e) => reach.has(e.a));
	if (between.length === 1) return done({ kind: 'series-parallel', term: between[0].term });
	return done({ kind: 'not-series-parallel', left: between.length }, between);
}

/** Edges of the biconnected component that holds the virtual edge a–b (Hopcroft–Tarjan, 1973). */
function blockWith(edges: SpEdge[], a: number, b: number): SpEdge[] {
	const all = [...edges, { a, b, term: { kind: 'leaf', name: '', value: 0 } as SpTerm }];
	const virtual = edges.length;
	const adj = new Map<number, number[]>();
	all.forEach((e, i) => {
		(adj.get(e.a) ?? adj.set(e.a, []).get(e.a)!).push(i);
		(adj.get(e.b) ?? adj.set(e.b, []).get(e.b)!).push(i);
	});
	const disc = new Map<number, number>();
	const low = new Map<number, number>();
	const stack: number[] = [];
	let found: number[] | null = null;
	let time = 0;
	// Iterative depth-first search: frames of (node, edge in, next adjacency index).
	const frames: { n: number; via: number; k: number }[] = [{ n: a, via: -1, k: 0 }];
	disc.set(a, time);
	low.set(a, time++);
	while (frames.length && !found) {
		const f = frames[frames.length - 1];
		const list = adj.get(f.n)!;
		if (f.k < list.length) {
			const i = list[f.k++];
			if (i === f.via) continue;
			const e = all[i];
			const m = e.a === f.n ? e.b : e.a;
			if (!disc.has(m)) {
				stack.push(i);
				disc.set(m, time);
				low.set(m, time++);
				frames.push({ n: m, via: i, k: 0 });
			} else if (disc.get(m)! < disc.get(f.n)!) {
				stack.push(i);
				low.set(f.n, Math.min(low.get(f.n)!, disc.get(m)!));
			}
			continue;
		}
		frames.pop();
		const parent = frames[frames.length - 1];
		if (!parent) break;
		low.set(parent.n, Math.min(low.get(parent.n)!, low.get(f.n)!));
		if (low.get(f.n)! >= disc.get(parent.n)!) {
			// parent.n separates this block: pop its edges.
			const block: number[] = [];
			for (;;) {
				const i = stack.pop()!;
				block.push(i);
				if (i === f.via) break;
			}
			if (block.includes(virtual)) found = block;
		}
	}
	return (found ?? []).filter((i) => i !== virtual).map((i) => all[i]);
}

/** Edges with adjacency by node; adding an edge parallel to a live one merges them at once. */
class Graph {
	private edges: (SpEdge | null)[] = [];
	private adj = new Map<number, Set<number>>();
	private byPair = new Map<string, number>();

	add(a: number, b: number, term: SpTerm): void {
		const key = a < b ? `${a},${b}` : `${b},${a}`;
		const same = this.byPair.get(key);
		if (same !== undefined) {
			this.edges[same]!.term = combine('parallel', this.edges[same]!.term, term);
			return;
		}
		const i = this.edges.length;
		this.edges.push({ a, b, term });
		this.byPair.set(key, i);
		for (const n of [a, b]) (this.adj.get(n) ?? this.adj.set(n, new Set()).get(n)!).add(i);
	}

	remove(i: number): SpEdge {
		const e = this.edges[i]!;
		this.edges[i] = null;
		this.byPair.delete(e.a < e.b ? `${e.a},${e.b}` : `${e.b},${e.a}`);
		this.adj.get(e.a)!.delete(i);
		this.adj.get(e.b)!.delete(i);
		return e;
	}

	edgesAt(n: number): number[] {
		return [...(this.adj.get(n) ?? [])];
	}

	nodes(): number[] {
		return [...this.adj.keys()];
	}

	live(): SpEdge[] {
		return this.edges.filter((e): e is SpEdge => e !== null);
	}
}

function reachable(edges: SpEdge[], from: number): Set<number> {
	const adj = new Map<number, number[]>();
	for (const e of edges) {
		(adj.get(e.a) ?? adj.set(e.a, []).get(e.a)!).push(e.b);
		(adj.get(e.b) ?? adj.set(e.b, []).get(e.b)!).push(e.a);
	}
	const seen = new Set<number>([from]);
	const stack = [from];
	while (stack.length) {
		for (const m of adj.get(stack.pop()!) ?? []) {
			if (seen.has(m)) continue;
			seen.add(m);
			stack.push(m);
		}
	}
	return seen;
}

function combine(kind: 'series' | 'parallel', x: SpTerm, y: SpTerm): SpTerm {
	// Flatten: (A + B) + C is A + B + C. Terms belong to one edge and the merged edges are
	// dropped, so the left group may grow in place (a long chain stays linear, not quadratic).
	const tail = y.kind === kind ? y.parts : [y];
	if (x.kind === kind) {
		for (const t of tail) x.parts.push(t);
		return x;
	}
	return { kind, parts: [x, ...tail] };
}

/** The value of a term: series adds, parallel adds conductances. */
export function termValue(t: SpTerm): number {
	if (t.kind === 'leaf') return t.value;
	if (t.kind === 'series') return t.parts.reduce((s, p) => s + termValue(p), 0);
	return 1 / t.parts.reduce((s, p) => s + 1 / termValue(p), 0);
}

/** "Rtop ∥ (Rsrc + Radc)": a series group inside a parallel one is bracketed, and vice versa only where needed. */
export function termText(t: SpTerm, inside: 'series' | 'parallel' | null = null): string {
	if (t.kind === 'leaf') return t.name;
	const text = t.parts.map((p) => termText(p, t.kind)).join(t.kind === 'series' ? ' + ' : ' ∥ ');
	return inside && inside !== t.kind ? `(${text})` : text;
}
