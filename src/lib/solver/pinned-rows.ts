import type { Triplets } from './kernels/pencil-residual';

/**
 * Unknowns fixed by a row with a single entry of G + sC: a node held by an ideal source to the
 * reference (v = value), a branch whose only equation is its own. Solved from that row alone
 * they are exact; mixed through an orthogonal reduction they are not (the input node's voltage
 * in a derivative solve, exactly 0, comes out as ~1e-37, which no relative change of its row
 * explains), so hessenberg-route.ts sets them from their rows.
 */
export interface PinnedRows {
	row: Int32Array;
	col: Int32Array;
	/** The entry's G and C parts: the entry at s is g + s·c. */
	g: Float64Array;
	c: Float64Array;
}

export function pinnedRows(n: number, g: Triplets, cap: Triplets): PinnedRows {
	const entries: Map<number, { g: number; c: number }>[] = Array.from(
		{ length: n },
		() => new Map()
	);
	const add = (r: number, c: number, gv: number, cv: number) => {
		const e = entries[r].get(c) ?? { g: 0, c: 0 };
		e.g += gv;
		e.c += cv;
		entries[r].set(c, e);
	};
	for (let k = 0; k < g.v.length; k++) add(g.r[k], g.c[k], g.v[k], 0);
	for (let k = 0; k < cap.v.length; k++) add(cap.r[k], cap.c[k], 0, cap.v[k]);
	const rows: number[] = [];
	const cols: number[] = [];
	const gs: number[] = [];
	const cs: number[] = [];
	const taken = new Set<number>();
	for (let r = 0; r < n; r++) {
		const live = [...entries[r]].filter(([, e]) => e.g !== 0 || e.c !== 0);
		// Two rows pinning one unknown would be a singular network: left to the LU.
		if (live.length !== 1 || taken.has(live[0][0])) continue;
		taken.add(live[0][0]);
		rows.push(r);
		cols.push(live[0][0]);
		gs.push(live[0][1].g);
		cs.push(live[0][1].c);
	}
	return {
		row: Int32Array.from(rows),
		col: Int32Array.from(cols),
		g: Float64Array.from(gs),
		c: Float64Array.from(cs)
	};
}

/** Sets each pinned unknown from its row: x_j = rhs_i / (g + s·c). */
export function pinUnknowns(
	p: PinnedRows,
	sr: number,
	si: number,
	x: { re: Float64Array; im: Float64Array },
	rhs: { re: Float64Array; im: Float64Array }
): void {
	for (let k = 0; k < p.row.length; k++) {
		const ar = p.g[k] + sr * p.c[k];
		const ai = si * p.c[k];
		const d = ar * ar + ai * ai;
		const br = rhs.re[p.row[k]];
		const bi = rhs.im[p.row[k]];
		x.re[p.col[k]] = (br * ar + bi * ai) / d;
		x.im[p.col[k]] = (bi * ar - br * ai) / d;
	}
}
