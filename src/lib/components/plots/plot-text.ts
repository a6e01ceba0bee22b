// The plots in words, for people who cannot see them (and anyone who wants the numbers): a
// one-line summary and a short table of samples beside each plot (plot-data.svelte).
import { hz, sec } from './ticks';

// Rounded first, so −0.0 reads 0.0; minus signs as people write them.
const signed = (v: number, digits: number) =>
	(Number(v.toFixed(digits)) || 0).toFixed(digits).replace('-', '−');
const dB = (v: number) => `${signed(v, 1)} dB`;
const deg = (v: number) => `${signed(v, 0)}°`;

/**
 * About `n` sample indices spread evenly along the axis (by log of x when `log`), always with
 * the first and the last, none twice. Non-finite or non-positive x (on a log axis) are skipped.
 */
export function spreadIndices(x: number[], n: number, log = false): number[] {
	const ok = x.flatMap((v, i) => (Number.isFinite(v) && (!log || v > 0) ? [i] : []));
	if (ok.length <= n) return ok;
	const at = (i: number) => (log ? Math.log10(x[i]) : x[i]);
	const lo = at(ok[0]);
	const hi = at(ok[ok.length - 1]);
	const out: number[] = [];
	let k = 0;
	for (let j = 0; j < n; j++) {
		const target = lo + ((hi - lo) * j) / (n - 1);
		while (k < ok.length - 1 && Math.abs(at(ok[k + 1]) - target) <= Math.abs(at(ok[k]) - target))
			k++;
		if (out[out.length - 1] !== ok[k]) out.push(ok[k]);
	}
	return out;
}

/** "0.0 dB at 10 Hz, −3 dB at 1.77 kHz, −40.2 dB at 1 GHz; phase 0° to −90°." */
export function frequencySummary(r: {
	f: number[];
	magnitudeDb: (number | null)[];
	phaseDeg: (number | null)[];
	bandwidth: number | null;
}): string {
	const idx = r.f.flatMap((_, i) => (r.magnitudeDb[i] !== null ? [i] : []));
	if (!idx.length) return 'No frequency response: the magnitude is not finite at any frequency.';
	const first = idx[0];
	const last = idx[idx.length - 1];
	const parts = [`${dB(r.magnitudeDb[first]!)} at ${hz(r.f[first])}`];
	parts.push(
		r.bandwidth !== null ? `−3 dB at ${hz(r.bandwidth)}` : 'no −3 dB point in the range shown'
	);
	parts.push(`${dB(r.magnitudeDb[last]!)} at ${hz(r.f[last])}`);
	const ph = r.phaseDeg.filter((v): v is number => v !== null && Number.isFinite(v));
	const phase = ph.length ? `; phase ${deg(ph[0])} to ${deg(ph[ph.length - 1])}` : '';
	return `Magnitude ${parts.join(', ')}${phase}.`;
}

/** "Rises 10–90 % in 1.21 µs, overshoots 3.1 %, settles within 1 % by 8.4 µs; final value 0.1." */
export function stepSummary(s: {
	riseTime: number | null;
	overshoot: number | null;
	settlingTime: number | null;
	final: number | null;
}): string {
	const parts = [
		s.riseTime !== null
			? `rises 10–90 % in ${sec(s.riseTime)}`
			: 'no 10–90 % rise in the time shown',
		// The solver gives overshoot in per cent; below 0.01 % it is round-off, not overshoot.
		s.overshoot !== null && s.overshoot >= 0.01
			? `overshoots ${Number(s.overshoot.toPrecision(3))} %`
			: 'no overshoot',
		s.settlingTime !== null
			? `settles within 1 % by ${sec(s.settlingTime)}`
			: 'does not settle within 1 % in the time shown'
	];
	const fin =
		s.final !== null && Number.isFinite(s.final) ? `; final value ${s.final.toPrecision(4)}` : '';
	const text = parts.join(', ') + fin + '.';
	return text[0].toUpperCase() + text.slice(1);
}
