/** Disjoint sets over node indices; ground (-1) is stored at slot n so it unions like any node. */
export class UnionFind {
	private readonly parent: Int32Array;

	constructor(private readonly n: number) {
		this.parent = new Int32Array(n + 1);
		for (let i = 0; i <= n; i++) this.parent[i] = i;
	}

	private slot(node: number): number {
		return node < 0 ? this.n : node;
	}

	find(node: number): number {
		let x = this.slot(node);
		while (this.parent[x] !== x) {
			this.parent[x] = this.parent[this.parent[x]];
			x = this.parent[x];
		}
		return x;
	}

	/** Returns false when a and b were already joined (the edge closes a loop). */
	union(a: number, b: number): boolean {
		const ra = this.find(a);
		const rb = this.find(b);
		if (ra === rb) return false;
		this.parent[ra] = rb;
		return true;
	}

	connected(a: number, b: number): boolean {
		return this.find(a) === this.find(b);
	}

	/** The representative of ground's set. */
	groundRoot(): number {
		return this.find(-1);
	}
}
