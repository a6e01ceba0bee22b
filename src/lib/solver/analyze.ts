import { byMagnitude, singularity } from './singularity';
import { computePoles, computeZeros, zerosReducible, type Root } from './poles';
import { dcInputImpedance } from './input-impedance';
import { modalForm } from './modal';
import { assemble } from './assemble';
import { directSystem } from './direct-solve';
import {
	atInfinity,
	bandwidthDirect,
	groupDelay,
	magnitudeDb,
	phaseDeg,
	phaseProbe,
	resonancesOf,
	sweep
} from './direct-response';
import { AGREE, disagreement, zerosAtOrigin } from './agreement';
import { checkedZeros } from './zero-check';
import { expansion } from './expansion';
import { logSpace, pzForm, type PzForm } from './frequency-response';
import { poleInfo } from './pole-info';
import { denominatorForEstimates } from './pole-estimates';
import { groupReactivePorts, withMembers } from './reactive-ports';
import { resistanceFormulas } from './resistance-formulas';
import { findDoublets } from './doublets';
import { portMatrices } from './port-matrices';
import { portModelFrom, type PortModel } from './port-model';
import { sequentialTimeConstants } from './sequential';
import { shortCircuitTimeConstantsRC } from './short-circuit-rc';
import { shiftedModel } from './shift';
import { stepInWindow } from './step-choice';
import {
	openCircuitPorts,
	openCircuitTimeConstants,
	shortCircuitPorts,
	shortCircuitTimeConstants
} from './time-constants';
import { validateNetwork } from './validate';
import { analysisWarnings, pairPolesAndZeros } from './warnings';
import { frequencyRange, numeratorScale } from './response-range';
import type { Analysis, AnalyzeOptions, ResistanceFormula, Warning } from './types';
import { SolverError } from './errors';
import { analyzeLarge } from './large/analyze-large';

const nullIfBad = (x: number) => (Number.isFinite(x) ? x : null);
const withFormulas = <T>(list: T[], formulas: ResistanceFormula[]) =>
	list.map((t, i) => ({ ...t, formula: formulas[i] }));

/**
 * Above this many reactive elements the front door takes the sparse back end (large/): the
 * dense one computes every pole and zero in O(m³), the sparse one the k dominant poles in
 * about O(nnz of the factor) per iteration. Chosen by measurement (docs/performance.md,
 * "Large networks"): where the dense full analysis leaves the interactive budget.
 */
export const SPARSE_ABOVE = 400;

/** Validate, then compute everything; see docs/network-format.md "Analysis result". */
export function analyze(doc: unknown, options: AnalyzeOptions = {}): Analysis {
	const started = performance.now();
	const net = validateNetwork(doc);
	const backend = options.backend ?? 'auto';
	if (backend === 'sparse' || (backend === 'auto' && net.reactive.length > SPARSE_ABOVE))
		return analyzeLarge(net, options, started);
	const extra: Warning[] = [];
	// The time-constant views work on ports (node pairs); the poles on the elements themselves.
	const { net: tcNet, ports } = groupReactivePorts(net);
	const ocPorts = openCircuitPorts(tcNet);
	const oc = openCircuitTimeConstants(tcNet, ocPorts);
	// Larger RC networks: the diagonal of H⁻¹ by Cholesky (short-circuit-rc.ts). Otherwise the
	// direct infinite-value configuration: with banded factorization (lu.ts) it costs less than
	// inverting the whole m×m port matrix (K = −H⁻¹, 9× slower at m = 1000), exact by structure.
	const viaRC = shortCircuitTimeConstantsRC(tcNet, ocPorts);
	const scPorts = viaRC ? null : shortCircuitPorts(tcNet);
	const sc = viaRC ?? shortCircuitTimeConstants(tcNet, scPorts!);
	for (const [ports, config] of [
		[ocPorts, 'open-circuit (zero-value)'],
		[scPorts, 'short-circuit (infinite-value)']
	] as const) {
		for (const c of ports?.conflicts ?? []) {
			extra.push({
				code: 'inconsistent_configuration',
				message: `in the ${config} configuration ${c.by.length ? c.by.join(', ') : 'the shorted elements'} short the ideal output of ${c.element}; the time constants that depend on it are unknown (null)`,
				element: c.element
			});
		}
	}
	if (ocPorts.singular && net.reactive.length > 0) {
		extra.push({
			code: 'no_dc_solution',
			message:
				'the resistive network has no unique DC solution; its time constants are reported as unknown (null)'
		});
	}
	const sequential = net.reactive.length ? sequentialTimeConstants(tcNet, ocPorts) : [];

	let roots: Root[] = [];
	let zeroRoots: Root[] = [];
	let pz: PzForm | null = null;
	let md: ReturnType<typeof modalForm> | null = null;
	let elementsOfPorts: number[] = [];
	let portModelUsed: PortModel | null = null;
	let repair: { candidates: Root[]; atOrigin: number; s0: number; h0: number } | null = null;
	let symmetric = false;
	// The network equations themselves: ground truth for every response (direct-solve.ts).
	const assembled = net.reactive.length === 0 ? assemble(net, () => 'pencil') : null;
	let sys = assembled ? directSystem(assembled) : null;
	let inf: ReturnType<typeof atInfinity> = { degree: 0, value: nullIfBad(ocPorts.h0) };
	if (net.reactive.length === 0) {
		if (ocPorts.singular)
			throw new SolverError('singular', "the network's equations have no unique solution");
		pz =
			Number.isFinite(ocPorts.h0) && ocPorts.h0 !== 0
				? {
						logK: Math.log(Math.abs(ocPorts.h0)),
						argK: ocPorts.h0 < 0 ? Math.PI : 0,
						poles: [],
						zeros: []
					}
				: null;
		md = { direct: ocPorts.h0, poles: [] };
	} else {
		const { a, pm, s0 } = shiftedModel(net, oc, sc);
		sys = directSystem(a, s0, pm.inverse ?? null);
		elementsOfPorts = pm.elements;
		const poleSolve = computePoles(a, pm);
		roots = poleSolve.roots;
		portModelUsed = pm;
		symmetric = Boolean(poleSolve.sp.basis);
		md = modalForm(pm, roots, 'transfer');
		// How many finite zeros there are: poles minus the relative degree, read from the
		// network equations far above every pole (direct-response.ts), not from residues.
		const top = Math.max(0, ...roots.map((r) => Math.hypot(r.re, r.im))) || s0;
		inf = atInfinity(sys, top);
		const expected = inf.degree === null ? null : Math.max(0, roots.length - inf.degree);
		if (inf.degree === null && inf.value === null)
			extra.push({
				code: 'high_frequency_unknown',
				message:
					'the behaviour at infinite frequency could not be read from the network equations: H(∞) and the number of finite zeros are unknown'
			});
		const atOrigin = zerosAtOrigin(sys, roots);
		let zpm = pm;
		// With every port mode finite and no finite zero expected, the zero eigenproblem would
		// only return values that the check below discards (an RC ladder read at its end).
		let z =
			expected === 0 && roots.length === pm.m && zerosReducible(pm)
				? []
				: computeZeros(a, pm, poleSolve.sp);
		for (const f of [3.7, 0.21, 17]) {
			if (z) break;
			zpm = portModelFrom(a, s0 * f);
			if (zpm.pivotRatio > 1e-13) z = computeZeros(a, zpm);
		}
		if (z) {
			repair = { candidates: z, atOrigin, s0: zpm.s0, h0: zpm.h0 };
			const checked = checkedZeros(sys, z, roots, expected, atOrigin);
			let zs = checked.zeros;
			if (expected !== null && zs.length > expected) {
				// Keep the ones nearest the shift: the rest are infinite zeros rounded to finite.
				const near = (x: { re: number; im: number }) => Math.hypot(zpm.s0 - x.re, x.im);
				zs = zs
					.slice()
					.sort((x, y) => near(x) - near(y))
					.slice(0, expected);
			}
			if (checked.found > 0)
				extra.push({
					code: 'zero_recovered',
					message: `${checked.found} zero${checked.found > 1 ? 's' : ''} beside a pole (near cancellation) recovered from the network equations`
				});
			zeroRoots = zs.map((x) => ({ ...x, muRe: 0, muIm: 0, partner: -1, vectors: null }));
			pz = pzForm(roots, zeroRoots, zpm.s0, zpm.h0);
		} else
			extra.push({
				code: 'zero_transfer',
				message: 'the transfer function is identically zero (the output does not see the input)'
			});
	}

	// Zeros beside poles do not move the range: it can be set before the list is final.
	const range = frequencyRange(roots, zeroRoots, options.frequency || undefined);
	const freq =
		options.frequency === false
			? null
			: logSpace(range.fMin, range.fMax, options.frequency?.points ?? 200);
	// Every analysis sweeps the network equations over frequencies spanning all poles and zeros:
	// the response grid when there is one, else 60 points (ten a decade or more) for the checks.
	const grid = freq ?? logSpace(range.fMin, range.fMax, 60);
	const vInput = net.elements[net.input].type === 'V';
	const sw = sweep(sys!, grid, true, vInput);
	let frequencyResponse: Analysis['frequencyResponse'] = null;
	if (freq) {
		const delay = groupDelay(sw);
		const phase = phaseDeg(sw, delay, {
			probe: phaseProbe(sys!),
			resonances: resonancesOf(roots, zeroRoots)
		});
		if (phase.unresolvedAt !== null)
			extra.push({
				code: 'phase_unresolved',
				message: `the phase could not be followed above ${phase.unresolvedAt.toPrecision(4)} Hz (it turns faster than the solves could track); it is left out there`
			});
		frequencyResponse = {
			f: freq,
			magnitudeDb: magnitudeDb(sw),
			phaseDeg: phase.phaseDeg,
			groupDelay: delay
		};
	}
	let worst = disagreement(pz, sw);
	if (worst && worst.size > AGREE && repair && sys) {
		// Second chance: look for a zero beside every pole, whatever the count said, and keep the
		// longer list if the pole–zero form then agrees better with the network equations.
		const again = checkedZeros(sys, repair.candidates, roots, null, repair.atOrigin);
		if (again.zeros.length > zeroRoots.length) {
			const zr = again.zeros.map((x) => ({ ...x, muRe: 0, muIm: 0, partner: -1, vectors: null }));
			const pz2 = pzForm(roots, zr, repair.s0, repair.h0);
			const w2 = disagreement(pz2, sw);
			if (w2 && w2.size < worst.size) {
				zeroRoots = zr;
				pz = pz2;
				worst = w2;
				extra.push({
					code: 'zero_recovered',
					message: `${again.found} zero${again.found > 1 ? 's' : ''} beside a pole (near cancellation) recovered from the network equations`
				});
			}
		}
	}
	if (worst && worst.size > AGREE) {
		extra.push({
			code: 'pole_zero_disagreement',
			message: `the pole–zero form differs from the network equations by ${worst.size.toPrecision(2)} (relative) at ${worst.f.toPrecision(4)} Hz; the responses come from the network equations, the pole and zero lists may be incomplete or inexact there`
		});
	}
	const order = roots.map((_, i) => i).sort((i, j) => byMagnitude(roots[i], roots[j]));
	const poleAtZero = roots.some((r) => r.re === 0 && r.im === 0);
	const dcGain = poleAtZero || ocPorts.singular ? null : nullIfBad(ocPorts.h0);
	const b = denominatorForEstimates(
		oc,
		ocPorts,
		order.map((i) => roots[i])
	);
	const poles = poleInfo(net, roots, order, sequential, elementsOfPorts, b);
	const zeros: Analysis['zeros'] = zeroRoots
		.slice()
		.sort(byMagnitude)
		.map((r) => ({ ...singularity(r.re, r.im), cancels: null }));
	const pairs = pairPolesAndZeros(poles, zeros);
	const doublets = findDoublets(net, poles, zeros, dcGain, { oc, sc }, options.doubletRatio);

	const bw = bandwidthDirect(sys!, dcGain, sw);

	let step: Analysis['step'] = null;
	const stable = poles.every((p) => p.re < 0);
	if (options.step !== false && md) {
		const slow = Math.min(...poles.filter((p) => p.re !== 0).map((p) => Math.abs(p.re)), Infinity);
		const fast = Math.max(...poles.map((p) => Math.hypot(p.re, p.im)), 0);
		const tEnd =
			options.step?.tEnd ?? (Number.isFinite(slow) ? 10 / slow : fast > 0 ? 10 / fast : 1);
		const chosen = stepInWindow(
			{
				md,
				pm: portModelUsed,
				symmetric,
				finitePoles: roots.length,
				dInf: inf.value,
				final: stable ? dcGain : null,
				tEnd,
				tFast: fast > 0 ? 1 / fast : tEnd,
				points: options.step?.points ?? 200,
				sweep: sw
			},
			options.step?.tEnd !== undefined
		);
		step = chosen.step;
		extra.push(...chosen.warnings);
	}
	const zinDc = dcInputImpedance(net, ocPorts, poleAtZero);
	const zin = freq && options.impedanceCurve !== false ? sw.zin : [];
	const exp =
		net.reactive.length && options.expansion !== false
			? expansion(tcNet, ocPorts, roots, zeroRoots, numeratorScale(pz, roots, zeroRoots, dcGain))
			: null;

	const result: Omit<Analysis, 'warnings' | 'meta'> = {
		title: net.title,
		poles,
		zeros,
		pairs,
		doublets,
		dcGain,
		highFrequencyGain: inf.value,
		timeConstants: {
			openCircuit: withFormulas(withMembers(net, ports, oc), resistanceFormulas(tcNet, 'open', oc)),
			shortCircuit: withFormulas(
				withMembers(net, ports, sc),
				resistanceFormulas(tcNet, 'short', sc)
			),
			sequential: withMembers(net, ports, sequential).map(({ value: _, ...s }) => s)
		},
		portMatrices: portMatrices(
			tcNet,
			ocPorts,
			ports.map((p) => p.members.map((k) => net.elements[k].id))
		),
		expansion: exp,
		frequencyResponse,
		bandwidth: bw,
		step,
		inputImpedance: {
			dc: zinDc,
			f: options.impedanceCurve === false ? [] : (freq ?? []),
			magnitude: zin.map((z) => (z ? nullIfBad(Math.hypot(z.re, z.im)) : null)),
			phaseDeg: zin.map((z) => (z ? nullIfBad((Math.atan2(z.im, z.re) * 180) / Math.PI) : null))
		}
	};
	return {
		...result,
		warnings: analysisWarnings(net, result, extra),
		poleSet: { method: 'all', total: roots.length, computed: roots.length, shift: null },
		meta: {
			elements: net.elements.length,
			nodes: net.nodeNames.length + 1,
			reactive: net.reactive.length,
			ms: performance.now() - started,
			backend: 'dense'
		}
	};
}
