import type { Analysis, PoleInfo, ResolvedNetwork, Warning } from './types';

/** Pole–zero pairs closer than 1 % of the pole's magnitude: flagged, never dropped. */
export function pairPolesAndZeros(poles: PoleInfo[], zeros: Analysis['zeros']): Analysis['pairs'] {
	const pairs: Analysis['pairs'] = [];
	const usedZero = new Set<number>();
	poles.forEach((p, i) => {
		let best = -1;
		let bestD = Infinity;
		zeros.forEach((z, j) => {
			if (usedZero.has(j)) return;
			const d = Math.hypot(p.re - z.re, p.im - z.im);
			if (d < bestD) {
				bestD = d;
				best = j;
			}
		});
		const mag = Math.hypot(p.re, p.im);
		const rel = mag > 0 ? bestD / mag : bestD === 0 ? 0 : Infinity;
		if (best >= 0 && rel < 0.01) {
			usedZero.add(best);
			pairs.push({ pole: i, zero: best, distance: rel });
			p.cancelledBy = best;
			zeros[best].cancels = i;
		}
	});
	return pairs;
}

export function analysisWarnings(
	net: ResolvedNetwork,
	a: Pick<Analysis, 'poles' | 'pairs' | 'expansion'>,
	extra: Warning[]
): Warning[] {
	const out = [...net.warnings, ...extra];
	for (const pr of a.pairs) {
		const p = a.poles[pr.pole];
		const owner = p.owners[0]?.element;
		out.push({
			code: 'pole_zero_pair',
			message: `pole at ${p.hz.toPrecision(4)} Hz and a zero are ${(pr.distance * 100).toPrecision(2)} % apart (near cancellation)`,
			...(owner ? { element: owner } : {})
		});
	}
	if (a.poles.some((p) => p.re > 0)) {
		out.push({ code: 'unstable', message: 'the network has a pole in the right half-plane' });
	}
	return out;
}
