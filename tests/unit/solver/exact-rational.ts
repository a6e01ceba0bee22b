import { Fraction } from 'fraction.js';

/**
 * Exact rational reference for small networks: its own modified-nodal stamps (independent of
 * src/lib/solver/assemble.ts), det(G + sC) and the transfer numerator as polynomials in s with
 * exact rational coefficients (fraction.js, BigInt), found by exact elimination at s = 0, 1, …, m
 * and Newton interpolation. By Cramer's rule H(s) = −det([[A, b], [cᵀ, 0]]) / det(A).
 * Element values are taken as the exact rationals of their doubles.
 */
type Doc = {
	elements: {
		id: string;
		type: string;
		nodes: string[];
		value?: string | number;
		control?: string;
	}[];
	input: string;
	output: { node: string; reference?: string | undefined };
};

const ZERO = new Fraction(0);
const ONE = new Fraction(1);

/** The exact rational value of a double (m·2^e). */
export function exact(x: number): Fraction {
	if (x === 0) return ZERO;
	if (!Number.isFinite(x)) throw new Error('non-finite value');
	let e = 0;
	let m = Math.abs(x);
	while (!Number.isInteger(m)) {
		m *= 2;
		e--;
	}
	const num = BigInt(m) * (x < 0 ? -1n : 1n);
	return e < 0 ? new Fraction(num, 2n ** BigInt(-e)) : new Fraction(num);
}

interface Exact {
	n: number;
	G: Fraction[][];
	C: Fraction[][];
	b: Fraction[];
	c: Fraction[];
}

export function exactSystem(input: unknown): Exact {
	const doc = input as Doc;
	const names = new Map<string, number>();
	const node = (x: string | number) => {
		const s = String(x);
		if (s === 'gnd') return -1;
		if (!names.has(s)) names.set(s, names.size);
		return names.get(s)!;
	};
	for (const e of doc.elements) for (const s of e.nodes) node(s);
	const branch = new Map<string, number>();
	let n = names.size;
	for (const e of doc.elements)
		if (['V', 'L', 'VCVS', 'OPAMP', 'CCVS'].includes(e.type)) branch.set(e.id, n++);
	const mat = () => Array.from({ length: n }, () => Array.from({ length: n }, () => ZERO));
	const G = mat();
	const C = mat();
	const add = (M: Fraction[][], r: number, c: number, v: Fraction) => {
		if (r >= 0 && c >= 0) M[r][c] = M[r][c].add(v);
	};
	const val = (e: Doc['elements'][number]) => exact(Number(e.value));
	for (const e of doc.elements) {
		const [a, b, cp, cn] = e.nodes.map(node);
		const br = branch.get(e.id) ?? -1;
		if (e.type === 'R' || e.type === 'C') {
			const M = e.type === 'R' ? G : C;
			const y = e.type === 'R' ? ONE.div(val(e)) : val(e);
			add(M, a, a, y);
			add(M, b, b, y);
			add(M, a, b, y.neg());
			add(M, b, a, y.neg());
		} else if (e.type === 'V' || e.type === 'L' || e.type === 'VCVS') {
			add(G, a, br, ONE);
			add(G, b, br, ONE.neg());
			add(G, br, a, ONE);
			add(G, br, b, ONE.neg());
			if (e.type === 'L') add(C, br, br, val(e).neg());
			if (e.type === 'VCVS') {
				add(G, br, cp, val(e).neg());
				add(G, br, cn, val(e));
			}
		} else if (e.type === 'VCCS') {
			add(G, a, cp, val(e));
			add(G, a, cn, val(e).neg());
			add(G, b, cp, val(e).neg());
			add(G, b, cn, val(e));
		} else if (e.type === 'OPAMP') {
			const out = e.nodes.map(node)[2];
			add(G, out, br, ONE.neg());
			add(G, br, a, ONE);
			add(G, br, b, ONE.neg());
		} else if (e.type !== 'I') throw new Error(`exactSystem: ${e.type} not supported`);
	}
	const bv = Array.from({ length: n }, () => ZERO);
	const inp = doc.elements.find((e) => e.id === doc.input)!;
	if (inp.type === 'V') bv[branch.get(inp.id)!] = ONE;
	else {
		const [p, q] = inp.nodes.map(node);
		if (p >= 0) bv[p] = ONE;
		if (q >= 0) bv[q] = ONE.neg();
	}
	const cv = Array.from({ length: n }, () => ZERO);
	const o = node(doc.output.node);
	const r = doc.output.reference ? node(doc.output.reference) : -1;
	if (o >= 0) cv[o] = cv[o].add(ONE);
	if (r >= 0) cv[r] = cv[r].sub(ONE);
	return { n, G, C, b: bv, c: cv };
}

function det(M: Fraction[][]): Fraction {
	const a = M.map((row) => row.slice());
	const n = a.length;
	let d = ONE;
	for (let k = 0; k < n; k++) {
		let p = k;
		while (p < n && a[p][k].equals(0)) p++;
		if (p === n) return ZERO;
		if (p !== k) {
			[a[p], a[k]] = [a[k], a[p]];
			d = d.neg();
		}
		d = d.mul(a[k][k]);
		for (let i = k + 1; i < n; i++) {
			if (a[i][k].equals(0)) continue;
			const f = a[i][k].div(a[k][k]);
			for (let j = k; j < n; j++) a[i][j] = a[i][j].sub(f.mul(a[k][j]));
		}
	}
	return d;
}

/** Coefficients (ascending powers) of the polynomial through (k, v_k), k = 0…m, exactly. */
function interpolate(values: Fraction[]): Fraction[] {
	const m = values.length - 1;
	const dd = values.slice();
	for (let j = 1; j <= m; j++) for (let i = m; i >= j; i--) dd[i] = dd[i].sub(dd[i - 1]).div(j);
	// Newton form Σ dd_i Π_{k<i} (s − k) → monomial coefficients.
	let coef: Fraction[] = [dd[m]];
	for (let i = m - 1; i >= 0; i--) {
		const next = Array.from({ length: coef.length + 1 }, () => ZERO);
		coef.forEach((c, k) => {
			next[k + 1] = next[k + 1].add(c);
			next[k] = next[k].sub(c.mul(i));
		});
		next[0] = next[0].add(dd[i]);
		coef = next;
	}
	while (coef.length > 1 && coef[coef.length - 1].equals(0)) coef.pop();
	return coef;
}

export interface ExactTransfer {
	/** Numerator and denominator coefficients, ascending powers of s (exact). */
	num: Fraction[];
	den: Fraction[];
}

export function exactTransfer(doc: unknown): ExactTransfer {
	const sys = exactSystem(doc);
	const m = sys.n;
	const at = (s: number, border: boolean) => {
		const A = sys.G.map((row, i) => row.map((g, j) => g.add(sys.C[i][j].mul(s))));
		if (!border) return det(A);
		const B = A.map((row, i) => [...row, sys.b[i]]);
		B.push([...sys.c, ZERO]);
		return det(B).neg();
	};
	const pts = Array.from({ length: m + 2 }, (_, k) => k);
	return {
		num: interpolate(pts.map((s) => at(s, true))),
		den: interpolate(pts.map((s) => at(s, false)))
	};
}

const isZero = (p: Fraction[]) => p.every((c) => c.equals(0));

/** Degree of a polynomial (−1 for the zero polynomial). */
export const degree = (p: Fraction[]) => (isZero(p) ? -1 : p.length - 1);

/** Powers of s that divide p (zeros at the origin). */
export const lowOrder = (p: Fraction[]) => p.findIndex((c) => !c.equals(0));

/** log10 of a positive rational, from its BigInt digits (no overflow at any size). */
function log10(q: Fraction): number {
	const lg = (x: bigint) => {
		const s = x.toString();
		const head = Number(s.slice(0, 17));
		return Math.log10(head) + (s.length - Math.min(17, s.length));
	};
	return lg(q.n) - lg(q.d);
}

/** p(jω) as [re, im], exactly. */
function atJw(p: Fraction[], w: Fraction): [Fraction, Fraction] {
	let re = ZERO;
	let im = ZERO;
	let pw = ONE;
	p.forEach((c, k) => {
		const t = c.mul(pw);
		// j^k: 1, j, −1, −j
		if (k % 4 === 0) re = re.add(t);
		else if (k % 4 === 1) im = im.add(t);
		else if (k % 4 === 2) re = re.sub(t);
		else im = im.sub(t);
		pw = pw.mul(w);
	});
	return [re, im];
}

/** 20·log10|H(jω)| and the phase (rad), with ω given as an exact rational. */
export function exactResponse(t: ExactTransfer, w: Fraction): { db: number; phase: number } {
	const [nr, ni] = atJw(t.num, w);
	const [dr, di] = atJw(t.den, w);
	const n2 = nr.mul(nr).add(ni.mul(ni));
	const d2 = dr.mul(dr).add(di.mul(di));
	// H = N·conj(D)/|D|²; its angle from the exact real and imaginary parts.
	const hr = nr.mul(dr).add(ni.mul(di));
	const hi = ni.mul(dr).sub(nr.mul(di));
	const scale = (q: Fraction) =>
		q.equals(0)
			? 0
			: Math.sign(Number(q.s)) * 10 ** (log10(q.abs()) - log10(hr.abs().add(hi.abs())));
	return { db: 10 * (log10(n2) - log10(d2)), phase: Math.atan2(scale(hi), scale(hr)) };
}

/** Value of p at a complex point in floating point, and the scale Σ|c_k||s|^k it is judged by. */
export function evalAt(p: Fraction[], re: number, im: number): { abs: number; scale: number } {
	let vr = 0;
	let vi = 0;
	let scale = 0;
	const r = Math.hypot(re, im);
	for (let k = p.length - 1; k >= 0; k--) {
		const c = p[k].valueOf();
		[vr, vi] = [vr * re - vi * im + c, vr * im + vi * re];
		scale = scale * r + Math.abs(c);
	}
	return { abs: Math.hypot(vr, vi), scale };
}
