import { byMagnitude, singularity } from './singularity';
import { computePoles, computeZeros, zerosReducible, type Root } from './poles';
import { dcInputImpedance, impedanceFromReading } from './input-impedance';
import { evalModal, modalForm, relativeDegree } from './modal';
import { expansion } from './expansion';
import { evalPz, logSpace, pzForm, unwrapDeg, type PzForm } from './frequency-response';
import { poleInfo } from './pole-info';
import { denominatorForEstimates } from './pole-estimates';
import { groupReactivePorts, withMembers } from './reactive-ports';
import { resistanceFormulas } from './resistance-formulas';
import { findDoublets } from './doublets';
import { portMatrices } from './port-matrices';
import { portModelFrom } from './port-model';
import { sequentialTimeConstants } from './sequential';
import { shortCircuitTimeConstantsRC } from './short-circuit-rc';
import { shiftedModel } from './shift';
import { stepResponse } from './step-response';
import {
	openCircuitPorts,
	openCircuitTimeConstants,
	shortCircuitPorts,
	shortCircuitTimeConstants
} from './time-constants';
import { validateNetwork } from './validate';
import { analysisWarnings, pairPolesAndZeros } from './warnings';
import { bandwidth, frequencyRange, numeratorScale } from './response-range';
import type { Analysis, AnalyzeOptions, ResistanceFormula, Warning } from './types';
import { SolverError } from './errors';

const LN10 = Math.log(10);
const nullIfBad = (x: number) => (Number.isFinite(x) ? x : null);
const withFormulas = <T>(list: T[], formulas: ResistanceFormula[]) =>
	list.map((t, i) => ({ ...t, formula: formulas[i] }));

/** Validate, then compute everything; see docs/network-format.md "Analysis result". */
export function analyze(doc: unknown, options: AnalyzeOptions = {}): Analysis {
	const started = performance.now();
	const net = validateNetwork(doc);
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
	let mdZ: ReturnType<typeof modalForm> | null = null;
	let elementsOfPorts: number[] = [];
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
		mdZ = { direct: ocPorts.hz0, poles: [] };
	} else {
		const { a, pm, s0 } = shiftedModel(net, oc, sc);
		elementsOfPorts = pm.elements;
		const poleSolve = computePoles(a, pm);
		roots = poleSolve.roots;
		md = modalForm(pm, roots, 'transfer');
		mdZ = modalForm(pm, roots, 'zin');
		// Keep as many zeros as the relative degree allows, the ones nearest the shift first:
		// the rest are infinite zeros that rounding pushed to enormous finite values.
		const count = Math.max(0, roots.length - relativeDegree(md, pm.h0));
		let zpm = pm;
		// With every port mode finite the modal form is exact, so no finite zero means the zero
		// eigenproblem would only return values that the count below discards (an RC ladder).
		let z =
			count === 0 && roots.length === pm.m && zerosReducible(pm)
				? []
				: computeZeros(a, pm, poleSolve.sp);
		for (const f of [3.7, 0.21, 17]) {
			if (z) break;
			zpm = portModelFrom(a, s0 * f);
			if (zpm.pivotRatio > 1e-13) z = computeZeros(a, zpm);
		}
		if (z) {
			const byMu = z
				.map((r, i) => ({ i, mu: Math.hypot(r.muRe, r.muIm) }))
				.sort((x, y) => y.mu - x.mu);
			const keep = new Set(
				byMu.slice(0, Math.max(count, z.length > roots.length ? z.length : 0)).map((x) => x.i)
			);
			zeroRoots = z.filter((_, i) => keep.has(i));
			pz = pzForm(roots, zeroRoots, zpm.s0, zpm.h0);
		} else
			extra.push({
				code: 'zero_transfer',
				message: 'the transfer function is identically zero (the output does not see the input)'
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

	const range = frequencyRange(poles, zeros, options.frequency || undefined);
	const freq =
		options.frequency === false
			? null
			: logSpace(range.fMin, range.fMax, options.frequency?.points ?? 200);
	let frequencyResponse: Analysis['frequencyResponse'] = null;
	if (freq) {
		const vals = freq.map((f) => (pz ? evalPz(pz, 2 * Math.PI * f) : null));
		frequencyResponse = {
			f: freq,
			magnitudeDb: vals.map((v) => (v ? nullIfBad((20 * v.logMag) / LN10) : null)),
			phaseDeg: unwrapDeg(vals.map((v) => (v ? nullIfBad((v.arg * 180) / Math.PI) : null))),
			groupDelay: vals.map((v) => (v ? nullIfBad(v.groupDelay) : null))
		};
	}
	const bw = pz ? bandwidth(pz, dcGain, range) : null;

	let step: Analysis['step'] = null;
	const stable = poles.every((p) => p.re < 0);
	if (options.step !== false && md) {
		const slow = Math.min(...poles.filter((p) => p.re !== 0).map((p) => Math.abs(p.re)), Infinity);
		const fast = Math.max(...poles.map((p) => Math.hypot(p.re, p.im)), 0);
		const tEnd =
			options.step?.tEnd ?? (Number.isFinite(slow) ? 10 / slow : fast > 0 ? 10 / fast : 1);
		step = stepResponse(
			md,
			stable ? dcGain : null,
			tEnd,
			fast > 0 ? 1 / fast : tEnd,
			options.step?.points ?? 200
		);
		if (pz && freq) {
			// The residues rest on eigenvectors; check them against the pole–zero form once.
			const w = 2 * Math.PI * Math.sqrt(range.fMin * range.fMax);
			const v = evalModal(md, 0, w);
			const ref = evalPz(pz, w);
			const mag = Math.exp(ref.logMag);
			if (Math.abs(Math.hypot(v.re, v.im) - mag) > 1e-6 * mag + 1e-300) {
				extra.push({
					code: 'step_inaccurate',
					message:
						'the pole–residue form disagrees with the pole–zero form (near-repeated poles); the step response may be inaccurate'
				});
			}
		}
	}
	const zinDc = dcInputImpedance(net, ocPorts, poleAtZero);
	const zin =
		freq && mdZ && options.impedanceCurve !== false
			? freq.map((f) => {
					const v = evalModal(mdZ!, 0, 2 * Math.PI * f);
					return impedanceFromReading(net, v.re, v.im);
				})
			: [];
	const exp =
		net.reactive.length && options.expansion !== false
			? expansion(tcNet, ocPorts, roots, zeroRoots, numeratorScale(pz, roots, zeroRoots, dcGain))
			: null;
	const improper = zeroRoots.length > roots.length;

	const result: Omit<Analysis, 'warnings' | 'meta'> = {
		title: net.title,
		poles,
		zeros,
		pairs,
		doublets,
		dcGain,
		highFrequencyGain: md && !improper ? nullIfBad(md.direct) : null,
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
		meta: {
			elements: net.elements.length,
			nodes: net.nodeNames.length + 1,
			reactive: net.reactive.length,
			ms: performance.now() - started
		}
	};
}
