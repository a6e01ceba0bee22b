import type { DcPorts } from './dc-ports';
import { rootPolynomial } from './pole-estimates';
import type { Analysis, ExpansionCoefficient, ExpansionTerm, ResolvedNetwork } from './types';

/**
 * Time- and transfer-constant expansion (Hajimiri, IEEE TCAS-I 57(6), 2010):
 *   H(s) = (a0 + a1 s + a2 s² + …) / (1 + b1 s + b2 s² + …),
 *   b_k = Σ over k-sets {i < j < …} of τ_i⁰ τ_j^i τ_l^{ij} …   (zero-value τ, then each with the
 *         earlier ones at their infinite value),
 *   a_k = Σ over the same sets of the same product times H^{ij…} (the DC gain with the set at
 *         infinite value).
 * Each product telescopes into a principal minor of the time-constant matrix T = D·H
 * (each τ is a Schur pivot), and each numerator term into a bordered minor, which is how they are
 * computed here. Orders up to 3 are enumerated term by term (denominator pairs always,
 * numerator pairs while m ≤ 30, triples while m ≤ 12); the coefficient itself, to order 12, comes from the exact poles and zeros, so the
 * listed terms double as a check.
 */
const MAX_ORDER = 12;
const LIST = 12;

function det(a: number[][]): number {
	const n = a.length;
	const m = a.map((r) => r.slice());
	let d = 1;
	for (let k = 0; k < n; k++) {
		let p = k;
		for (let i = k + 1; i < n; i++) if (Math.abs(m[i][k]) > Math.abs(m[p][k])) p = i;
		if (m[p][k] === 0) return 0;
		if (p !== k) {
			[m[p], m[k]] = [m[k], m[p]];
			d = -d;
		}
		d *= m[k][k];
		for (let i = k + 1; i < n; i++) {
			const f = m[i][k] / m[k][k];
			for (let j = k; j < n; j++) m[i][j] -= f * m[k][j];
		}
	}
	return d;
}

function subsets(m: number, k: number, each: (s: number[]) => void): void {
	const s: number[] = [];
	const rec = (start: number) => {
		if (s.length === k) return each(s.slice());
		for (let i = start; i < m; i++) {
			s.push(i);
			rec(i + 1);
			s.pop();
		}
	};
	rec(0);
}

export function expansion(
	net: ResolvedNetwork,
	oc: DcPorts,
	poles: { re: number; im: number }[],
	zeros: { re: number; im: number }[],
	numeratorScale: number | null
): Analysis['expansion'] {
	if (
		oc.singular ||
		oc.conflicts.length ||
		oc.infinite.some((x) => x) ||
		poles.some((p) => p.re === 0 && p.im === 0)
	)
		return null;
	const m = oc.m;
	const id = (i: number) => net.elements[oc.elements[i]].id;
	const T = (i: number, j: number) => oc.d[i] * oc.H[i * m + j];
	const bTot = rootPolynomial(poles, Math.min(MAX_ORDER, poles.length));
	const z0 = zeros.filter((z) => z.re === 0 && z.im === 0).length;
	const aTot = rootPolynomial(
		zeros.filter((z) => z.re !== 0 || z.im !== 0),
		Math.min(MAX_ORDER, zeros.length)
	);

	const denominator: ExpansionCoefficient[] = [];
	const numerator: ExpansionCoefficient[] = [];
	let pairTerms: ExpansionTerm[] = [];
	for (let k = 1; k < bTot.length; k++) {
		const terms: ExpansionTerm[] = [];
		if (k === 1) for (let i = 0; i < m; i++) terms.push({ elements: [id(i)], value: T(i, i) });
		if (k === 2) {
			// All pairs at any size: O(m²) 2×2 minors kept as numbers; objects only for the top ones.
			const top = topPairs(m, (i, j) => T(i, i) * T(j, j) - T(i, j) * T(j, i), LIST);
			pairTerms = top.terms.map(([i, j, v]) => ({ elements: [id(i), id(j)], value: v }));
			denominator.push({
				order: 2,
				value: Number.isFinite(bTot[2]) ? bTot[2] : top.sum,
				termSum: top.sum,
				termCount: top.count,
				terms: pairTerms.slice(0, LIST)
			});
			continue;
		}
		if (k === 3 && m <= 12) {
			subsets(m, k, (s) => {
				terms.push({ elements: s.map(id), value: det(s.map((i) => s.map((j) => T(i, j)))) });
			});
		}
		denominator.push(coefficient(k, bTot[k], terms));
	}
	for (let k = 0; k <= Math.min(MAX_ORDER, zeros.length); k++) {
		const terms: ExpansionTerm[] = [];
		if (k <= 1 || (k === 2 && m <= 30) || (k === 3 && m <= 12)) {
			subsets(m, k, (s) => {
				const rows = s.map((i) => [...s.map((j) => oc.H[i * m + j]), oc.h[i]]);
				rows.push([...s.map((j) => oc.g[j]), oc.h0]);
				const dd = s.reduce((p, i) => p * oc.d[i], 1);
				terms.push({ elements: s.map(id), value: dd * det(rows) });
			});
		}
		const value = numeratorScale === null ? NaN : k < z0 ? 0 : numeratorScale * aTot[k - z0];
		numerator.push(coefficient(k, value, terms));
	}
	const b2 = denominator[1]?.value ?? 0;
	const dominantPairs: { elements: [string, string]; value: number; fraction: number }[] = [];
	let acc = 0;
	for (const t of pairTerms.sort((x, y) => Math.abs(y.value) - Math.abs(x.value))) {
		if (dominantPairs.length >= 5 || (b2 !== 0 && acc >= 0.9 * Math.abs(b2))) break;
		acc += Math.abs(t.value);
		dominantPairs.push({
			elements: [t.elements[0], t.elements[1]],
			value: t.value,
			fraction: b2 ? t.value / b2 : 0
		});
	}
	return { denominator, numerator, dominantPairs };
}

/** Sum, count and the `keep` largest-magnitude values of f over all pairs i < j. */
function topPairs(m: number, f: (i: number, j: number) => number, keep: number) {
	let sum = 0;
	const best: [number, number, number][] = [];
	let floor = 0;
	for (let i = 0; i < m; i++) {
		for (let j = i + 1; j < m; j++) {
			const v = f(i, j);
			sum += v;
			if (best.length < keep || Math.abs(v) > floor) {
				// Insert in place (largest |v| first, ties after the earlier pair), as a stable
				// sort of the appended list would: m² candidates, so no re-sort per insertion.
				let at = best.length;
				while (at > 0 && Math.abs(best[at - 1][2]) < Math.abs(v)) at--;
				best.splice(at, 0, [i, j, v]);
				if (best.length > keep) best.pop();
				floor = Math.abs(best[best.length - 1][2]);
			}
		}
	}
	return { sum, count: (m * (m - 1)) / 2, terms: best };
}

function coefficient(order: number, value: number, terms: ExpansionTerm[]): ExpansionCoefficient {
	const listed = terms.length > 0 || order === 0;
	const termSum = listed ? terms.reduce((s, t) => s + t.value, 0) : null;
	const top = terms
		.slice()
		.sort((a, b) => Math.abs(b.value) - Math.abs(a.value))
		.slice(0, LIST);
	return {
		order,
		value: Number.isFinite(value) ? value : (termSum ?? NaN),
		termSum,
		termCount: terms.length,
		terms: top
	};
}
