import { evalPz, pzForm, type PzForm } from '../solver/frequency-response';
import { impedanceFromReading } from '../solver/input-impedance';
import { evalModal, modalForm, relativeDegree, type Modal } from '../solver/modal';
import { computePoles, computeZeros, type Root } from '../solver/poles';
import { portModelFrom, SINGULAR_PIVOT, type PortModel } from '../solver/port-model';
import { frequencyRange } from '../solver/response-range';
import { shiftedModel } from '../solver/shift';
import { byMagnitude } from '../solver/singularity';
import { stepMetrics, stepResponse } from '../solver/step-response';
import {
	openCircuitPorts,
	openCircuitTimeConstants,
	shortCircuitPorts,
	shortCircuitTimeConstants
} from '../solver/time-constants';
import { SolverError } from '../solver/errors';
import type { Prepared } from './prepared';
import { fastBandwidth, logMag2 } from './fast-figures';

/**
 * The figures a design aid compares between variants of one network, computed on the prepared
 * (already assembled) structure with the solver's own steps: shifted port model, poles, zeros,
 * pole–zero and pole–residue forms. It skips what the full analysis adds for reading (time
 * constants, expansion, participation, plotted responses), which is most of its cost.
 */
export interface Point {
	re: number;
	im: number;
}

export interface Metrics {
	poles: Point[];
	zeros: Point[];
	dcGain: number | null;
	/** −3 dB frequency, Hz. */
	bandwidth: number | null;
	riseTime: number | null;
	/** Step overshoot, percent. */
	overshoot: number | null;
	settlingTime: number | null;
	/** Largest |deviation| of |H| from its DC value over the band, dB. */
	flatnessDb: number | null;
	/** Largest pole Q (0.5 for real poles). */
	maxQ: number | null;
	inputResistance: number | null;
	/** Im(Yin)/ω at `inputAt`, farads. */
	inputCapacitance: number | null;
}

export interface Band {
	fLo: number;
	fHi: number;
}

export interface EvaluateOptions {
	band?: Band | null;
	bandPoints?: number;
	step?: boolean;
	inputAt?: number | null;
	/** Shift for the reduction; defaults to the one chosen for the nominal network. */
	shift?: number;
}

export interface Evaluation extends Metrics {
	pz: PzForm | null;
	modal: Modal | null;
	/** A shift in the geometric middle of these poles: the best start for a neighbouring variant. */
	nextShift: number;
	/** The poles with their eigenvectors, and the shift they were computed at (for sensitivities). */
	roots: Root[];
	s0: number;
}

const LN10 = Math.log(10);
const SHIFT_FACTORS = [1, 2.718281828, 0.3678794412, 7.389056099, 0.1353352832, 20.08553692];

/** The reduction's shift for the prepared network at its present values (as the analysis picks it). */
export function naturalShift(p: Prepared): number {
	if (p.net.reactive.length === 0) return 0;
	const oc = openCircuitTimeConstants(p.net, openCircuitPorts(p.net));
	const sc = shortCircuitTimeConstants(p.net, shortCircuitPorts(p.net));
	return shiftedModel(p.net, oc, sc).s0;
}

function shiftedPortModel(p: Prepared, s0: number): PortModel {
	for (const f of SHIFT_FACTORS) {
		const pm = portModelFrom(p.assembled, s0 * f);
		if (pm.pivotRatio >= SINGULAR_PIVOT) return pm;
		if (s0 === 0) break;
	}
	throw new SolverError(
		'singular',
		"the network's equations have no unique solution at this value"
	);
}

export function evaluate(p: Prepared, shift: number, opts: EvaluateOptions = {}): Evaluation {
	const a = p.assembled;
	const pm = shiftedPortModel(p, p.net.reactive.length ? (opts.shift ?? shift) : 0);
	let roots: Root[] = [];
	let zeroRoots: Root[] = [];
	let pz: PzForm | null = null;
	let md: Modal;
	if (p.net.reactive.length === 0) {
		pz =
			Number.isFinite(pm.h0) && pm.h0 !== 0
				? { logK: Math.log(Math.abs(pm.h0)), argK: pm.h0 < 0 ? Math.PI : 0, poles: [], zeros: [] }
				: null;
		md = { direct: pm.h0, poles: [] };
	} else {
		roots = computePoles(a, pm).roots;
		md = modalForm(pm, roots, 'transfer');
		let zpm = pm;
		let z = computeZeros(a, pm);
		for (const f of [3.7, 0.21, 17]) {
			if (z) break;
			zpm = portModelFrom(a, pm.s0 * f);
			if (zpm.pivotRatio > SINGULAR_PIVOT) z = computeZeros(a, zpm);
		}
		if (z) {
			// As the analysis does: keep as many zeros as the relative degree allows, nearest the shift first.
			const count = Math.max(0, roots.length - relativeDegree(md, pm.h0));
			const byMu = z
				.map((r, i) => ({ i, mu: Math.hypot(r.muRe, r.muIm) }))
				.sort((x, y) => y.mu - x.mu);
			const keep = new Set(
				byMu.slice(0, Math.max(count, z.length > roots.length ? z.length : 0)).map((x) => x.i)
			);
			zeroRoots = z.filter((_, i) => keep.has(i));
			pz = pzForm(roots, zeroRoots, zpm.s0, zpm.h0);
		}
	}
	const poles = roots.map(({ re, im }) => ({ re, im })).sort(byMagnitude);
	const zeros = zeroRoots.map(({ re, im }) => ({ re, im })).sort(byMagnitude);
	const poleAtZero = poles.some((r) => r.re === 0 && r.im === 0);
	const gainAt = (w: number) => (pz ? evalPz(pz, w) : null);
	let dcGain: number | null = null;
	if (!poleAtZero) {
		const v = gainAt(0);
		dcGain = v ? (Math.cos(v.arg) < 0 ? -1 : 1) * Math.exp(v.logMag) : 0;
		if (!Number.isFinite(dcGain)) dcGain = null;
	}
	const bw = pz ? fastBandwidth(pz, dcGain, frequencyRange(poles, zeros)) : null;

	let riseTime: number | null = null;
	let overshoot: number | null = null;
	let settlingTime: number | null = null;
	const stable = poles.every((q) => q.re < 0);
	if (opts.step !== false && stable && dcGain) {
		const slow = Math.min(...poles.map((q) => Math.abs(q.re)), Infinity);
		const fast = Math.max(...poles.map((q) => Math.hypot(q.re, q.im)), 0);
		const tEnd = Number.isFinite(slow) ? 10 / slow : fast > 0 ? 10 / fast : 1;
		({ riseTime, overshoot, settlingTime } = stepMetrics(
			md,
			dcGain,
			tEnd,
			fast > 0 ? 1 / fast : tEnd
		));
	}

	let flatnessDb: number | null = null;
	if (opts.band && pz) {
		const { fLo, fHi } = opts.band;
		const ref = dcGain ? 2 * Math.log(Math.abs(dcGain)) : logMag2(pz, 2 * Math.PI * fLo);
		const n = Math.max(2, opts.bandPoints ?? 121);
		let worst = 0;
		for (let i = 0; i < n; i++) {
			const f = fLo * (fHi / fLo) ** (i / (n - 1));
			worst = Math.max(worst, Math.abs(logMag2(pz, 2 * Math.PI * f) - ref));
		}
		flatnessDb = Number.isFinite(worst) ? (10 * worst) / LN10 : null;
	}

	// The sweep's "largest pole Q" keeps |s|/(−2·re) for real poles too (0.5): a solve for a
	// target Q needs a figure that is continuous where a pair splits onto the real axis.
	let maxQ: number | null = null;
	for (const q of poles) {
		const mag = Math.hypot(q.re, q.im);
		const s = mag > 0 && q.re !== 0 ? mag / (-2 * q.re) : null;
		if (s !== null) maxQ = Math.max(maxQ ?? 0, s);
	}

	let inputResistance: number | null = null;
	let inputCapacitance: number | null = null;
	if (opts.inputAt !== undefined) {
		const mdZ: Modal = p.net.reactive.length
			? modalForm(pm, roots, 'zin')
			: { direct: pm.hz0, poles: [] };
		if (!poleAtZero) {
			const v = evalModal(mdZ, 0, 0);
			// A V input that draws no DC current looks into an open circuit: infinite, not unknown.
			const open = p.net.elements[p.net.input].type === 'V' && v.re === 0;
			inputResistance = open ? Infinity : (impedanceFromReading(p.net, v.re, 0)?.re ?? null);
		}
		if (opts.inputAt && opts.inputAt > 0) {
			const w = 2 * Math.PI * opts.inputAt;
			const v = evalModal(mdZ, 0, w);
			const z = impedanceFromReading(p.net, v.re, v.im);
			if (z) {
				const d = z.re * z.re + z.im * z.im;
				inputCapacitance = d > 0 ? -z.im / d / w : null;
			}
		}
	}
	const mags = poles.map((q) => Math.hypot(q.re, q.im)).filter((m) => m > 0);
	const nextShift = mags.length ? Math.sqrt(Math.min(...mags) * Math.max(...mags)) : pm.s0;
	return {
		poles,
		zeros,
		dcGain,
		bandwidth: bw,
		riseTime,
		overshoot,
		settlingTime,
		flatnessDb,
		maxQ,
		inputResistance,
		inputCapacitance,
		pz,
		modal: md,
		nextShift,
		roots,
		s0: pm.s0
	};
}

/** The plain figures only (what tables, CSV and job results store). */
export function metricsOf(e: Evaluation): Metrics {
	// eslint-disable-next-line @typescript-eslint/no-unused-vars
	const { pz, modal, nextShift, roots, s0, ...m } = e;
	return m;
}

/** |H| in dB at frequencies (Hz) from the pole–zero form; null where it is undefined. */
export function magnitudeDb(e: Evaluation, f: number[]): (number | null)[] {
	return f.map((x) => {
		if (!e.pz) return null;
		const v = (20 * evalPz(e.pz, 2 * Math.PI * x).logMag) / LN10;
		return Number.isFinite(v) ? v : null;
	});
}

/** Step response samples (normalized to nothing: volts per volt of step) on 0…tEnd. */
export function stepCurve(e: Evaluation, tEnd: number, points = 200): { t: number[]; y: number[] } {
	if (!e.modal) return { t: [], y: [] };
	const st = stepResponse(e.modal, null, tEnd, tEnd, points);
	return { t: st.t, y: st.y };
}
