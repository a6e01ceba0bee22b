import { SolverError } from '../errors';
import { logSpace } from '../frequency-response';
import {
	emptySweep,
	phaseDeg,
	resonancesOf,
	type PhaseProbe,
	type Sweep as DirectSweep
} from '../direct-response';
import { impedanceFromReading } from '../input-impedance';
import { poleEstimates } from '../pole-estimates';
import { groupReactivePorts, withMembers } from '../reactive-ports';
import { frequencyRange } from '../response-range';
import { resistanceFormulas } from '../resistance-formulas';
import { byMagnitude, singularity } from '../singularity';
import { stepResponse } from '../step-response';
import type {
	Analysis,
	AnalyzeOptions,
	PoleInfo,
	PortReading,
	ResolvedNetwork,
	Warning
} from '../types';
import { analysisWarnings } from '../warnings';
import { generalDominantPoles } from './dominant-general';
import { rcDominantPoles } from './dominant-rc';
import { elmoreDelays } from './elmore';
import { generalOpenCircuit, generalSequential } from './general-time-constants';
import { structuralPoleCount } from './pole-count';
import { generalPoleDetail, rcPoleDetail, type PoleDetail } from './pole-details';
import { nodalRC, rcDcReadings, symbolicOf } from './rc-nodal';
import { ldlSolve } from '../kernels/ldl';
import { reducedModal, reducedModelError } from './reduced-step';
import { primaModel, sweep, sweepRC, type Sweep } from './response-large';
import { sparseMna, type SparseMna } from './sparse-mna';
import { rcOpenCircuit, rcSequential } from './time-constants-rc';
import { luOrder, sparseLu } from '../kernels/sparse-lu';

export const DEFAULT_DOMINANT = 10;
/** Backward error a computed pole must meet (docs/methods.md, "Large networks"). */
export const BACKWARD_ERROR_LIMIT = 1e-10;
/** A reduced model that misses the direct solves by more than this (relative) is not used. */
export const REDUCED_MODEL_TOLERANCE = 1e-3;

const nullIfBad = (x: number) => (Number.isFinite(x) ? x : null);
const LN10 = Math.log(10);

/**
 * The sparse back end (docs/methods.md, "Large networks"): the k poles nearest a shift with
 * their modes, residues and owners; every open-circuit time constant; the first k steps of the
 * sequential estimate; the Elmore delay of RC trees; the frequency response and input
 * impedance by direct sparse solves; the step response from a checked PRIMA model. Zeros,
 * short-circuit time constants, port matrices and the expansion are not computed at this size
 * (each would cost a dense m×m problem); the answer says so in its warnings.
 */
export function analyzeLarge(
	net: ResolvedNetwork,
	options: AnalyzeOptions,
	started: number
): Analysis {
	const progress = options.onProgress ?? (() => {});
	const k = Math.max(1, Math.floor(options.dominant?.count ?? DEFAULT_DOMINANT));
	const near = options.dominant?.near ?? null;
	const extra: Warning[] = [];
	const { net: tcNet, ports } = groupReactivePorts(net);
	const rc = near === null || near >= 0 ? nodalRC(net) : null;
	let details: PoleDetail[];
	let shift: number;
	let method: 'lanczos' | 'arnoldi';
	let converged: boolean;
	let openReadings: PortReading[];
	let sequential: { element: string; tau: number | null }[];
	let dcFromRc: { h: number; zin: number } | null = null;
	progress(0.05, 'poles');
	if (rc && net.reactive.length > 0) {
		const dom = rcDominantPoles(rc, k, near, (c) => progress(0.05 + (0.4 * c) / k, 'poles'));
		details = dom.poles.map((p) => rcPoleDetail(net, rc, p));
		({ shift, converged } = dom);
		method = 'lanczos';
		progress(0.45, 'time constants');
		const oc = rcOpenCircuit(rc, tcNet, dom.shift === 0 && !rc.floating ? dom.factor : null);
		openReadings = oc.readings;
		sequential = rcSequential(rc, tcNet, oc, k);
		if (!rc.floating) {
			const inp = net.elements[net.input].nodes;
			dcFromRc = rcDcReadings(rc, (b) => ldlSolve(oc.factor, b), [inp[0], inp[1]]);
		}
	} else if (net.reactive.length > 0) {
		const mna = sparseMna(net);
		const dom = generalDominantPoles(mna, k, near, (c) => progress(0.05 + (0.4 * c) / k, 'poles'));
		if (!dom)
			throw new SolverError(
				'singular',
				"the network's equations have no unique solution at any frequency"
			);
		details = dom.poles.map((p) => generalPoleDetail(net, mna, p));
		({ shift, converged } = dom);
		method = 'arnoldi';
		progress(0.45, 'time constants');
		const oc = generalOpenCircuit(tcNet);
		openReadings = oc.readings;
		if (!oc.factor)
			extra.push({
				code: 'no_dc_solution',
				message:
					'the zero-value configuration has no unique DC solution at this size (a part without a DC path or a loop of shorts); its time constants are reported as unknown (null)'
			});
		sequential = generalSequential(tcNet, oc, k);
	} else {
		details = [];
		shift = 0;
		converged = true;
		method = 'lanczos';
		openReadings = [];
		sequential = [];
	}
	if (!converged)
		extra.push({
			code: 'poles_not_converged',
			message: `the iteration for the ${k} dominant poles stopped at its bound before every pole met its tolerance; poles whose backward error exceeds ${BACKWARD_ERROR_LIMIT} are flagged`
		});
	const loose = details.filter((d) => !(d.backwardError <= BACKWARD_ERROR_LIMIT));
	if (loose.length)
		extra.push({
			code: 'pole_inaccurate',
			message: `${loose.length} of the computed poles have a backward error above ${BACKWARD_ERROR_LIMIT} (worst ${Math.max(...loose.map((d) => d.backwardError)).toExponential(1)}); treat them as approximate`
		});
	details.sort(byMagnitude);
	const total = structuralPoleCount(net);
	const seqSteps = withMembers(net, ports, sequential).map(({ value: _, ...s }) => s);
	let b1 = 0;
	for (const r of openReadings) if (r.tau !== null && Number.isFinite(r.tau)) b1 += r.tau;
	const estimates = poleEstimates(details, [1, b1], sequential);
	const poles: PoleInfo[] = details.map((d, rank) => ({
		...singularity(d.re, d.im),
		estimate: estimates[rank][0] ?? null,
		estimates: estimates[rank],
		relativeError: estimates[rank][0]?.relativeError ?? null,
		owners: d.owners,
		cancelledBy: null,
		residue: d.residue,
		backwardError: d.backwardError
	}));

	// Responses: direct sparse solves per point — the nodal complex LDLᵀ for reciprocal RC
	// networks, the LU of the modified nodal equations otherwise (response-large.ts).
	progress(0.6, 'responses');
	// The modified nodal equations and their column order, built only when something needs them.
	let mna: SparseMna | null = null;
	let order: Int32Array | null = null;
	const mnaNow = () => (mna ??= sparseMna(net));
	const orderNow = () => (order ??= luOrder(mnaNow().pattern));
	const inputNodes = net.elements[net.input].nodes as [number, number];
	// The size of one solve: the nodal unknowns of an RC network, else the modified nodal size.
	const solveSize = () => (rc && !rc.floating ? rc.n : mnaNow().size);
	const solveAt = (f: number[], onPoint?: (d: number) => void): Sweep =>
		rc && !rc.floating
			? sweepRC(rc, symbolicOf(rc), f, inputNodes, onPoint)
			: sweep(mnaNow(), orderNow(), f, onPoint);
	const dcSweep = dcFromRc ? null : solveAt([0]);
	const dc = dcFromRc
		? { h: { re: dcFromRc.h, im: 0 }, zin: { re: dcFromRc.zin, im: 0 } }
		: { h: dcSweep!.h[0], zin: dcSweep!.zin[0] };
	const poleAtZero = details.some((d) => d.re === 0 && d.im === 0);
	const dcGain = poleAtZero ? null : nullIfBad(dc.h.re);
	const range = frequencyRange(details, [], options.frequency || undefined);
	let sw: Sweep | null = null;
	let frequencyResponse: Analysis['frequencyResponse'] = null;
	if (options.frequency !== false) {
		sw = solveAt(logSpace(range.fMin, range.fMax, options.frequency?.points ?? 200), (d) =>
			progress(0.6 + 0.2 * d, 'responses')
		);
		// The phase followed as on the dense path (direct-response.ts): the group delay from the
		// derivative solve predicts each step, and a step it cannot vouch for is split with one
		// more solve — a lumped line turns by tens of thousands of degrees over the sweep.
		const probe: PhaseProbe = (f) => {
			const one = solveAt([f]);
			const q = ratioOf(one.dh[0], one.h[0]);
			return q && Number.isFinite(q.re)
				? { arg: Math.atan2(one.h[0].im, one.h[0].re), delay: -q.re }
				: null;
		};
		const direct = asDirectSweep(sw);
		const delay = Array.from(direct.qRe, (q, i) => (direct.ok[i] ? nullIfBad(-q) : null));
		// Following the phase costs extra solves: up to 10 a point for lines of a few thousand
		// unknowns, fewer as each solve gets dearer (a 100,000-element mesh's response runs as a
		// job with a time limit), and never fewer than one a point. A count, not a clock, so the
		// same network always gets the same answer. Past it the phase is left out above where it
		// stopped, with a warning.
		const unknowns = Math.max(1, solveSize());
		const perPoint = Math.min(10, Math.max(1, Math.floor(50_000 / unknowns)));
		const phase = phaseDeg(direct, delay, {
			probe,
			resonances: resonancesOf(details),
			budget: perPoint * sw.f.length
		});
		if (phase.unresolvedAt !== null)
			extra.push({
				code: 'phase_unresolved',
				message: `the phase could not be followed above ${phase.unresolvedAt.toPrecision(4)} Hz (it turns faster than the solves could track); it is left out there`
			});
		frequencyResponse = {
			f: sw.f,
			magnitudeDb: sw.h.map((v) => nullIfBad((20 * Math.log(Math.hypot(v.re, v.im))) / LN10)),
			phaseDeg: phase.phaseDeg,
			groupDelay: delay
		};
	}
	const bw = sw && dcGain ? sweptBandwidth(solveAt, sw, dcGain) : null;

	progress(0.8, 'step');
	let step: Analysis['step'] = null;
	if (options.step !== false && details.length) {
		step = reducedStep(
			net,
			mnaNow(),
			orderNow(),
			sw ?? solveAt(logSpace(range.fMin, range.fMax, 40)),
			details,
			dcGain,
			options,
			extra
		);
	}
	const zinDc = poleAtZero ? null : impedanceFromReading(net, dc.zin.re, dc.zin.im);
	const zin =
		sw && options.impedanceCurve !== false
			? sw.zin.map((z) => impedanceFromReading(net, z.re, z.im))
			: [];
	const elmore = elmoreDelays(net);
	const outNode = net.output.node;
	extra.push({
		code: 'dominant_poles_only',
		message: `large network: ${details.length} of ${total ?? 'an unknown number of'} poles were computed (the ${details.length} nearest ${shift === 0 ? 'the origin: the slowest' : `the shift ${shift.toPrecision(3)} rad/s`}); zeros, short-circuit time constants, port matrices and the expansion are not computed at this size`
	});
	// Series–parallel formulas: resistance-formulas.ts declines quickly above its own size limit.
	const formulas = resistanceFormulas(tcNet, 'open', openReadings);
	const result: Omit<Analysis, 'warnings' | 'meta'> = {
		title: net.title,
		poles,
		zeros: [],
		pairs: [],
		doublets: [], // no zeros at this size, so no doublets
		dcGain,
		highFrequencyGain: null,
		timeConstants: {
			openCircuit: withMembers(net, ports, openReadings).map((t, i) => ({
				...t,
				formula: formulas[i]
			})),
			shortCircuit: [],
			sequential: seqSteps,
			elmore:
				elmore && outNode >= 0 && net.output.reference < 0
					? { node: net.nodeNames[outNode], delay: elmore[outNode] }
					: null
		},
		portMatrices: { ports: [], members: [], kinds: [], R: [], C: [] },
		expansion: null,
		frequencyResponse,
		bandwidth: bw,
		step,
		inputImpedance: {
			dc: zinDc,
			f: options.impedanceCurve === false ? [] : (sw?.f ?? []),
			magnitude: zin.map((z) => (z ? nullIfBad(Math.hypot(z.re, z.im)) : null)),
			phaseDeg: zin.map((z) => (z ? nullIfBad((Math.atan2(z.im, z.re) * 180) / Math.PI) : null))
		},
		poleSet: { method, total, computed: details.length, shift }
	};
	progress(1, 'done');
	return {
		...result,
		warnings: capWarnings(analysisWarnings(net, result, extra)),
		meta: {
			elements: net.elements.length,
			nodes: net.nodeNames.length + 1,
			reactive: net.reactive.length,
			ms: performance.now() - started,
			backend: 'sparse'
		}
	};
}

/** a / b, or null where b is 0 or either is not finite. */
function ratioOf(
	a: { re: number; im: number },
	b: { re: number; im: number }
): { re: number; im: number } | null {
	const d = b.re * b.re + b.im * b.im;
	if (!(d > 0) || !Number.isFinite(d)) return null;
	return { re: (a.re * b.re + a.im * b.im) / d, im: (a.im * b.re - a.re * b.im) / d };
}

/** The large sweep in the dense path's terms (ln|H|, arg H, H′/H), for its phase follower. */
function asDirectSweep(sw: Sweep): DirectSweep {
	const out: DirectSweep = emptySweep(sw.f);
	for (let i = 0; i < sw.f.length; i++) {
		const h = sw.h[i];
		if (!Number.isFinite(h.re) || !Number.isFinite(h.im)) continue;
		out.ok[i] = 1;
		if (h.re === 0 && h.im === 0) continue;
		out.logMag[i] = Math.log(Math.hypot(h.re, h.im));
		out.arg[i] = Math.atan2(h.im, h.re);
		const q = ratioOf(sw.dh[i], h);
		if (q) {
			out.qRe[i] = q.re;
			out.qIm[i] = q.im;
		}
	}
	return out;
}

/** First −3 dB crossing of the sweep, refined by bisection in log f with direct solves. */
function sweptBandwidth(solveAt: (f: number[]) => Sweep, sw: Sweep, dcGain: number): number | null {
	const target = Math.abs(dcGain) / Math.SQRT2;
	const mag = (f: number) => {
		const v = solveAt([f]).h[0];
		return Math.hypot(v.re, v.im);
	};
	for (let i = 1; i < sw.f.length; i++) {
		if (Math.hypot(sw.h[i].re, sw.h[i].im) < target) {
			let lo = Math.log(sw.f[i - 1]);
			let hi = Math.log(sw.f[i]);
			// 30 halvings of one grid step: f to about 1e-10 relative.
			for (let it = 0; it < 30 && hi - lo > 1e-12; it++) {
				const mid = 0.5 * (lo + hi);
				if (mag(Math.exp(mid)) < target) hi = mid;
				else lo = mid;
			}
			return Math.exp(0.5 * (lo + hi));
		}
	}
	return null;
}

function reducedStep(
	net: ResolvedNetwork,
	mna: ReturnType<typeof sparseMna>,
	order: Int32Array,
	sw: Sweep,
	poles: PoleDetail[],
	dcGain: number | null,
	options: AnalyzeOptions,
	extra: Warning[]
): Analysis['step'] {
	const rates = [0, ...[1, 0.1, 10].map((f) => f * Math.abs(poles[0].re))];
	let factor = null;
	let s0 = 0;
	for (const s of rates) {
		const f = sparseLu(
			{ ...mna.pattern, values: Float64Array.from(mna.g, (v, i) => v + s * mna.c[i]) },
			null,
			order
		);
		if (!f.singular && f.pivotRatio > 1e-13) {
			factor = f;
			s0 = s;
			break;
		}
	}
	if (!factor) return null;
	let worst = Infinity;
	for (const q of [30, 60, 120, 240]) {
		const md = reducedModal(primaModel(mna, factor, s0, q, net.nodeNames.length));
		if (!md) continue;
		worst = reducedModelError(md, sw);
		if (worst <= REDUCED_MODEL_TOLERANCE) {
			const slow = Math.min(...poles.map((p) => Math.abs(p.re)).filter((x) => x > 0));
			const fast = Math.max(...md.poles.map((p) => Math.hypot(p.re, p.im)), 0);
			const stable = poles.every((p) => p.re < 0);
			const tEnd =
				options.step && options.step.tEnd
					? options.step.tEnd
					: Number.isFinite(slow)
						? 10 / slow
						: 1;
			return stepResponse(
				md,
				stable ? dcGain : null,
				tEnd,
				fast > 0 ? 1 / fast : tEnd,
				(options.step && options.step.points) || 200
			);
		}
	}
	extra.push({
		code: 'step_inaccurate',
		message: `the reduced model for the step response misses the direct frequency response by ${Number.isFinite(worst) ? (worst * 100).toPrecision(2) + ' %' : 'an unknown amount'} (more than ${REDUCED_MODEL_TOLERANCE * 100} %); the step response is not reported`
	});
	return null;
}

/** Per warning code, the first WARNINGS_PER_CODE in full, then one line counting the rest: an
 *  extracted network can have thousands of dangling nodes, and the answer must stay readable. */
export const WARNINGS_PER_CODE = 20;
function capWarnings(list: Warning[]): Warning[] {
	const seen = new Map<string, number>();
	const out: Warning[] = [];
	for (const w of list) {
		const n = (seen.get(w.code) ?? 0) + 1;
		seen.set(w.code, n);
		if (n <= WARNINGS_PER_CODE) out.push(w);
	}
	for (const [code, n] of seen)
		if (n > WARNINGS_PER_CODE)
			out.push({
				code,
				message: `${n - WARNINGS_PER_CODE} more warnings of this kind (${code}) are not listed`
			});
	return out;
}
