import { analyze, frequencyResponseAt } from '../../../src/lib/solver/index';
import type { randomNetwork } from './random-networks';

/** Run both back ends on one network and collect the worst relative difference per quantity. */
export function compareBackends(doc: ReturnType<typeof randomNetwork>) {
	const frequency = { fMin: 1, fMax: 1e10, points: 60 };
	const dense = analyze(doc, { backend: 'dense', frequency, step: false });
	const sparse = analyze(doc, { backend: 'sparse', frequency, step: false });
	const worst: Record<string, number> = {};
	const note = (what: string, err: number) => (worst[what] = Math.max(worst[what] ?? 0, err));
	const k = Math.min(10, dense.poles.length);
	for (let i = 0; i < sparse.poles.length; i++) {
		const p = sparse.poles[i];
		// A pole at the origin is compared on the scale of the next one.
		const mag =
			Math.hypot(p.re, p.im) || Math.hypot(sparse.poles[1]?.re ?? 1, sparse.poles[1]?.im ?? 0);
		const nearest = Math.min(...dense.poles.map((q) => Math.hypot(q.re - p.re, q.im - p.im)));
		note('poles', nearest / mag);
	}
	// The sparse set is the k slowest: the dense k-th slowest bounds them all.
	if (k > 0 && sparse.poles.length === k) {
		const kth = Math.hypot(dense.poles[k - 1].re, dense.poles[k - 1].im);
		for (const p of sparse.poles)
			note('slowest set', Math.max(0, Math.hypot(p.re, p.im) / kth - 1));
	}
	const byId = new Map(dense.timeConstants.openCircuit.map((t) => [t.element, t]));
	// Relative to each τ, but never below 1e-12 of the network's largest: a τ that is exactly 0
	// on one side (an inductor seeing an open) is round-off (1e-25 s) on the other.
	let tauMax = 0;
	for (const t of dense.timeConstants.openCircuit)
		if (t.tau !== null) tauMax = Math.max(tauMax, Math.abs(t.tau));
	for (const t of sparse.timeConstants.openCircuit) {
		const d = byId.get(t.element)!;
		if (d.tau === null || t.tau === null) note('τ null agreement', d.tau === t.tau ? 0 : 1);
		else
			note('τ open', Math.abs(t.tau - d.tau) / Math.max(Math.abs(d.tau), 1e-12 * tauMax, 1e-300));
	}
	sparse.timeConstants.sequential.forEach((s, i) => {
		const d = dense.timeConstants.sequential[i];
		if (s.tau !== null && d?.tau != null) note('sequential τ', Math.abs(s.tau - d.tau) / d.tau);
	});
	if (dense.dcGain !== null && sparse.dcGain !== null)
		note('dc gain', Math.abs(sparse.dcGain - dense.dcGain) / Math.abs(dense.dcGain));
	// The response against the dense direct solve (frequencyResponseAt: one complex LU of the
	// whole network per point), the ground truth both back ends' curves answer to.
	const fs = sparse.frequencyResponse!;
	const direct = frequencyResponseAt(doc, fs.f) as { h: ({ re: number; im: number } | null)[] };
	const mags = direct.h.map((v) => (v ? Math.hypot(v.re, v.im) : NaN));
	const peak = Math.max(...mags.filter(Number.isFinite));
	fs.magnitudeDb.forEach((db, i) => {
		if (db === null || !Number.isFinite(mags[i])) return;
		// Linear magnitudes, relative to the response's peak (a deep notch is not an error of 1).
		note('response', Math.abs(mags[i] - 10 ** (db / 20)) / peak);
	});
	const dOwner = dense.poles[0]?.owners[0];
	const sOwner = sparse.poles[0]?.owners[0];
	if (dOwner && sOwner && dOwner.share > 1.01 * (dense.poles[0].owners[1]?.share ?? 0)) {
		note('owner', dOwner.element === sOwner.element ? Math.abs(dOwner.share - sOwner.share) : 1);
	}
	return { worst, dense, sparse };
}
