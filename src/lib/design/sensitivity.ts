import { cluFactor, cluSolve } from '../solver/complex-lu';
import { dot } from '../solver/assemble';
import { luFactor, luSolve, luSolveTransposed } from '../solver/lu';
import { SINGULAR_PIVOT } from '../solver/port-model';
import type { Root } from '../solver/poles';
import { evaluate, type Point } from './evaluate';
import type { Prepared, PreparedElement } from './prepared';
import { openVariants } from './variants';
import { applyValues } from './prepared';

/**
 * Normalized sensitivities S = (∂q/∂x)·(x/q) of each exact pole, of the −3 dB bandwidth and of
 * the DC gain to every element value.
 *
 * Poles: p is a root of det(G + sC) = 0 with right and left null vectors z, w (wᵀ(G + pC) = 0,
 * plain transpose), so first-order perturbation theory gives ∂p/∂x = −wᵀ(∂G/∂x + p ∂C/∂x)z / wᵀCz
 * (Wilkinson, "The Algebraic Eigenvalue Problem", 1965, §2 on simple eigenvalues, applied to the
 * pencil). The null vectors come from the port eigenvectors the solver already has: with
 * A0 = G + s0·C and port vectors V, z = A0⁻¹·V·x and w = A0⁻ᵀ·V·D·y for the right and left
 * eigenvectors x, y of D·H (see docs/design-aids.md), so one real factorization serves all poles.
 *
 * DC gain and bandwidth are adjoint sensitivities of H = cᵀA⁻¹b: ∂H/∂x = −λᵀ(∂A/∂x)u with
 * u = A⁻¹b, λ = A⁻ᵀc; the bandwidth moves along |H(jω₃)|² = |H(0)|²/2, so
 * ∂ω₃/∂x = −F_x / F_ω for F = ln|H(jω)|² − ln|H(0)|² + ln 2.
 */
export interface Entry {
	element: string;
	/** Complex S for a pole (im = 0 for real poles); real S for bandwidth and DC gain. */
	re: number;
	im: number;
	/** |S|: the ranking key. */
	magnitude: number;
}

export interface PoleSensitivity {
	pole: Point & { hz: number };
	entries: Entry[];
}

export interface SensitivityResult {
	elements: string[];
	poles: PoleSensitivity[];
	bandwidth: { value: number | null; entries: Entry[] };
	dcGain: { value: number | null; entries: Entry[] };
}

type C = [number, number];
const mul = (a: C, b: C): C => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const div = (a: C, b: C): C => {
	const d = b[0] * b[0] + b[1] * b[1];
	return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
};

/** wᵀ(∂A/∂θ-stamp)z for complex vectors given as re/im arrays. */
function stampForm(
	e: PreparedElement,
	n: number,
	wr: Float64Array,
	wi: Float64Array,
	zr: Float64Array,
	zi: Float64Array
): C {
	let re = 0;
	let im = 0;
	for (const s of e.stamp) {
		const r = Math.floor(s.at / n);
		const c = s.at - r * n;
		re += s.coef * (wr[r] * zr[c] - wi[r] * zi[c]);
		im += s.coef * (wr[r] * zi[c] + wi[r] * zr[c]);
	}
	return [re, im];
}

/** (wᵀvec)(vecᵀz) for one port. */
function portForm(
	p: Prepared,
	e: PreparedElement,
	wr: Float64Array,
	wi: Float64Array,
	zr: Float64Array,
	zi: Float64Array
): C {
	const vec = p.assembled.ports[e.port].vec;
	return mul([dot(vec, wr), dot(vec, wi)], [dot(vec, zr), dot(vec, zi)]);
}

/** ∂A/∂x in the form wᵀ(∂A/∂x)z, at complex frequency s. */
function derivativeForm(
	p: Prepared,
	e: PreparedElement,
	s: C,
	w: [Float64Array, Float64Array],
	z: [Float64Array, Float64Array]
): C {
	const n = p.assembled.size;
	const x = p.current[e.index];
	if (e.kind === 'port') {
		const f = portForm(p, e, w[0], w[1], z[0], z[1]);
		const sign = e.type === 'C' ? 1 : -1;
		return mul([sign * s[0], sign * s[1]], f);
	}
	const f = stampForm(e, n, w[0], w[1], z[0], z[1]);
	const dTheta = e.kind === 'conductance' ? -1 / (x * x) : 1;
	return [dTheta * f[0], dTheta * f[1]];
}

function entry(element: string, s: C): Entry {
	return { element, re: s[0], im: s[1], magnitude: Math.hypot(s[0], s[1]) };
}

const byMagnitude = (a: Entry, b: Entry) => b.magnitude - a.magnitude;

function poleSensitivities(p: Prepared, roots: Root[], s0: number): PoleSensitivity[] {
	const a = p.assembled;
	const n = a.size;
	const m = a.ports.length;
	const mat = a.g.slice();
	for (const port of a.ports)
		for (const [r, x] of port.vec)
			for (const [c, y] of port.vec) mat[r * n + c] += s0 * port.d * x * y;
	const lu = luFactor(mat, n);
	const out: PoleSensitivity[] = [];
	const sorted = roots
		.filter((r) => r.vectors)
		.sort((x, y) => Math.hypot(x.re, x.im) - Math.hypot(y.re, y.im) || x.im - y.im);
	for (const root of sorted) {
		const v = root.vectors!;
		const spread = (re: Float64Array | number[], im: Float64Array | number[]) => {
			const br = new Float64Array(n);
			const bi = new Float64Array(n);
			for (let k = 0; k < m; k++) {
				for (const [r, c] of a.ports[k].vec) {
					br[r] += c * re[k];
					bi[r] += c * im[k];
				}
			}
			return [br, bi] as [Float64Array, Float64Array];
		};
		const z = spread(v.xr, v.xi);
		luSolve(lu, z[0]);
		luSolve(lu, z[1]);
		const dyr = Array.from(v.yr, (y, k) => y * a.ports[k].d);
		const dyi = Array.from(v.yi, (y, k) => y * a.ports[k].d);
		const w = spread(dyr, dyi);
		luSolveTransposed(lu, w[0]);
		luSolveTransposed(lu, w[1]);
		let den: C = [0, 0];
		for (let k = 0; k < m; k++) {
			const vec = a.ports[k].vec;
			const f = mul([dot(vec, w[0]), dot(vec, w[1])], [dot(vec, z[0]), dot(vec, z[1])]);
			den = [den[0] + a.ports[k].d * f[0], den[1] + a.ports[k].d * f[1]];
		}
		const pole: C = [root.re, root.im];
		const entries = p.elements.map((e) => {
			const num = derivativeForm(p, e, pole, w, z);
			const dp = div([-num[0], -num[1]], den);
			return entry(e.id, div(mul(dp, [p.current[e.index], 0]), pole));
		});
		out.push({
			pole: { re: root.re, im: root.im, hz: Math.hypot(root.re, root.im) / (2 * Math.PI) },
			entries: entries.sort(byMagnitude)
		});
	}
	return out;
}

/** H(s), and the solutions u = A⁻¹b, λ = A⁻ᵀc at s = jω (complex LU of A and of Aᵀ). */
function adjointAt(p: Prepared, w: number) {
	const a = p.assembled;
	const n = a.size;
	const re = a.g.slice();
	const im = new Float64Array(n * n);
	for (const port of a.ports)
		for (const [r, x] of port.vec)
			for (const [c, y] of port.vec) im[r * n + c] += w * port.d * x * y;
	const tr = new Float64Array(n * n);
	const ti = new Float64Array(n * n);
	for (let i = 0; i < n; i++)
		for (let j = 0; j < n; j++) {
			tr[j * n + i] = re[i * n + j];
			ti[j * n + i] = im[i * n + j];
		}
	const f = cluFactor(re, im, n);
	const ft = cluFactor(tr, ti, n);
	if (f.singular || ft.singular) return null;
	const u: [Float64Array, Float64Array] = [new Float64Array(n), new Float64Array(n)];
	for (const [r, x] of a.b) u[0][r] += x;
	cluSolve(f, u[0], u[1]);
	const l: [Float64Array, Float64Array] = [new Float64Array(n), new Float64Array(n)];
	for (const [r, x] of a.c) l[0][r] += x;
	cluSolve(ft, l[0], l[1]);
	const h: C = [dot(a.c, u[0]), dot(a.c, u[1])];
	return { u, l, h };
}

/** Real-arithmetic adjoint at DC (G must be non-singular there). */
function dcAdjoint(p: Prepared) {
	const a = p.assembled;
	const n = a.size;
	const lu = luFactor(a.g.slice(), n);
	if (lu.pivotRatio < SINGULAR_PIVOT) return null;
	const u = new Float64Array(n);
	for (const [r, x] of a.b) u[r] += x;
	luSolve(lu, u);
	const l = new Float64Array(n);
	for (const [r, x] of a.c) l[r] += x;
	luSolveTransposed(lu, l);
	const zero = new Float64Array(n);
	return {
		u: [u, zero] as [Float64Array, Float64Array],
		l: [l, zero] as [Float64Array, Float64Array],
		h: dot(a.c, u)
	};
}

export function sensitivity(doc: unknown): SensitivityResult {
	const v = openVariants(doc);
	const p = v.prepared;
	applyValues(p, new Map());
	const e = evaluate(p, v.shift, { step: false });
	const poles = p.net.reactive.length ? poleSensitivities(p, e.roots, e.s0) : [];
	const dc = e.dcGain ? dcAdjoint(p) : null;
	const dcEntries = dc
		? p.elements
				.map((el) => {
					const d = derivativeForm(p, el, [0, 0], dc.l, dc.u);
					return entry(el.id, [(-d[0] * p.current[el.index]) / dc.h, 0]);
				})
				.sort(byMagnitude)
		: [];
	const bwEntries: Entry[] = [];
	if (e.bandwidth && dc) {
		const w3 = 2 * Math.PI * e.bandwidth;
		const at = adjointAt(p, w3);
		if (at) {
			// F_ω = 2 Re(H_ω / H) with H_ω = −λᵀ(jC)u.
			let cf: C = [0, 0];
			for (const port of p.assembled.ports) {
				const f = mul(
					[dot(port.vec, at.l[0]), dot(port.vec, at.l[1])],
					[dot(port.vec, at.u[0]), dot(port.vec, at.u[1])]
				);
				cf = [cf[0] + port.d * f[0], cf[1] + port.d * f[1]];
			}
			const hw = mul([0, -1], cf);
			const fw = 2 * div(hw, at.h)[0];
			for (const el of p.elements) {
				const d = derivativeForm(p, el, [0, w3], at.l, at.u);
				const hx = div([-d[0], -d[1]], at.h)[0];
				const d0 = derivativeForm(p, el, [0, 0], dc.l, dc.u);
				const h0x = -d0[0] / dc.h;
				const fx = 2 * hx - 2 * h0x;
				bwEntries.push(entry(el.id, [((-fx / fw) * p.current[el.index]) / w3, 0]));
			}
			bwEntries.sort(byMagnitude);
		}
	}
	return {
		elements: p.elements.map((x) => x.id),
		poles,
		bandwidth: { value: e.bandwidth, entries: bwEntries },
		dcGain: { value: e.dcGain, entries: dcEntries }
	};
}
