import type { Sweep } from './direct-response';
import { evalModal, type Modal } from './modal';
import type { PortModel } from './port-model';
import { stateModel, stateTransfer } from './state-model';
import { figuresOnGrid, metricsGrid, stepEvaluator, stepResponse } from './step-response';
import { stateStepper } from './step-state';
import { withLogSamples } from './step-log-samples';
import type { Analysis, Warning } from './types';

/**
 * The step response by a method that holds for the network at hand, checked before it is
 * published:
 * - the pole–residue sum whenever it passes the check below — always for reciprocal RC networks
 *   (symmetric eigenproblem, spectrum.ts), whose eigenvectors are orthogonal by the spectral
 *   theorem, so repeated or close poles leave the residues exact (no defective case exists);
 * - otherwise the matrix exponential of a state model (state-model.ts, step-state.ts), which
 *   needs no eigenvectors at all (repeated poles of an active network, doublets, high Q).
 * Either model must reproduce the network equations (the direct sweep) to 1e-8 at a dozen
 * frequencies spanning the poles — and the matrix-exponential stepping its own one-shot expm —
 * or the step response is not published: null, with a `step_untrusted` warning saying why.
 */
const MODEL_AGREE = 1e-8;
/** Most work (samples × cost of one) spent following a ringing response: a few tens of ms. */
const WORK = 4e6;

export interface StepInputs {
	md: Modal;
	pm: PortModel | null;
	symmetric: boolean;
	finitePoles: number;
	dInf: number | null;
	final: number | null;
	tEnd: number;
	tFast: number;
	points: number;
	sweep: Sweep;
}

/**
 * Worst difference between a model's H(jω) and the direct solve on ~12 points, relative to the
 * largest |H| of the sweep: the step response integrates H, so a difference at −300 dB, far
 * below the gain that shapes the step, does not matter to it.
 */
function modelDifference(
	s: Sweep,
	model: (w: number) => { re: number; im: number } | null
): number {
	let peak = -Infinity;
	for (let i = 0; i < s.f.length; i++) if (s.ok[i]) peak = Math.max(peak, s.logMag[i]);
	if (peak === -Infinity) return 0;
	let worst = 0;
	const stride = Math.max(1, Math.floor(s.f.length / 12));
	const k = Math.exp(-peak);
	for (let i = 0; i < s.f.length; i += stride) {
		if (!s.ok[i]) continue;
		const v = model(2 * Math.PI * s.f[i]);
		if (!v) return Infinity;
		// |v − h| / max|h|, both scaled by e^(−peak).
		const m = Math.exp(s.logMag[i] - peak);
		const d = Math.hypot(v.re * k - m * Math.cos(s.arg[i]), v.im * k - m * Math.sin(s.arg[i]));
		worst = Math.max(worst, Number.isNaN(d) ? Infinity : d);
	}
	return worst;
}

export function trustedStep(x: StepInputs): { step: Analysis['step']; warning: Warning | null } {
	const untrusted = (why: string) => ({
		step: null,
		warning: { code: 'step_untrusted', message: `the step response is not shown: ${why}` }
	});
	if (x.dInf === null)
		return untrusted('the transfer grows with frequency (no finite value at infinity)');
	const figuresWanted = x.final !== null && x.final !== 0 && Number.isFinite(x.final);
	// Ringing modes whose step amplitude |r/p| (from the residues, which are accurate for
	// well-separated modes and only overstated near a defect) stays below 1e-7 of the final
	// value cannot move a figure by 1e-6: they need no dense sampling.
	const ringing = figuresWanted
		? x.md.poles.filter(
				(p) =>
					p.im > 0 && Math.hypot(p.rr, p.ri) / Math.hypot(p.re, p.im) >= 1e-7 * Math.abs(x.final!)
			)
		: [];
	const samples = ringing.reduce((n, p) => {
		const stop = p.re < 0 ? Math.min(x.tEnd, 10 / -p.re) : x.tEnd;
		return n + Math.ceil((stop * p.im * 24) / (2 * Math.PI));
	}, 0);
	const tooLong: Warning = {
		code: 'step_untrusted',
		message: `the rise time, overshoot and settling time are not shown: the response rings for about ${Math.round(samples / 24)} periods, more than the analysis follows sample by sample`
	};
	const md = { ...x.md, direct: x.dInf };
	const modalDiff = modelDifference(x.sweep, (w) => evalModal(md, 0, w));
	// The residue form when it reproduces the network equations (always tried first: it is the
	// cheapest); otherwise the state model, whatever the network, checked the same way. For a
	// reciprocal network this second chance has not yet rescued a case (1,700 random RC networks
	// of 1–10 decades): where the residue form failed, a pole more than about twelve decades from
	// the rest had been cut as infinite (spectrum.ts) and the state model lacks it too.
	if (modalDiff <= MODEL_AGREE || !x.pm || x.finitePoles === 0) {
		if (modalDiff > MODEL_AGREE)
			return untrusted(
				`its pole–residue form differs from the network equations by ${modalDiff.toPrecision(2)} (relative)`
			);
		// Poles over more than two decades: log-spaced samples too, for a log time axis
		// (step-log-samples.ts; the same trusted pole–residue form).
		const curve = withLogSamples(stepResponse(md, null, x.tEnd, x.tFast, x.points), md, x.tFast);
		if (!figuresWanted) return { step: { ...curve, final: x.final }, warning: null };
		if (samples * Math.max(1, md.poles.length) > WORK)
			return { step: { ...curve, final: x.final }, warning: tooLong };
		// The log-spaced part of the analysis' grid, plus 24 samples a period of every ringing
		// mode that matters until it has decayed ten time constants.
		const real = { direct: md.direct, poles: md.poles.filter((p) => p.im === 0) };
		const ts = Array.from(metricsGrid(real, x.tEnd, Math.min(x.tFast, x.tEnd) * 1e-3));
		for (const p of ringing) {
			const stop = p.re < 0 ? Math.min(x.tEnd, 10 / -p.re) : x.tEnd;
			const count = Math.ceil((stop * p.im * 24) / (2 * Math.PI));
			for (let k = 1; k <= count; k++) ts.push((stop * k) / count);
		}
		const grid = Float64Array.from(ts).sort();
		const at = stepEvaluator(md);
		const u = (t: number) => at(t) / x.final!;
		const fig = figuresOnGrid(grid, Array.from(grid, u), u);
		return { step: { ...curve, ...fig, final: x.final }, warning: null };
	}
	const sm = stateModel(x.pm, x.finitePoles, x.dInf);
	if (!sm) return untrusted('no state model separates the finite poles from those at infinity');
	const diff = modelDifference(x.sweep, (w) => stateTransfer(sm, w));
	if (diff > MODEL_AGREE)
		return untrusted(
			`its state model differs from the network equations by ${diff.toPrecision(2)} (relative)`
		);
	const stepper = stateStepper(sm, x.tEnd);
	if (!stepper) return untrusted('the matrix exponential of its state model is not finite');
	const self = stepper.selfCheck();
	if (!(self <= 1e-8))
		return untrusted(
			`stepping the matrix exponential disagrees with its one-shot value by ${self.toPrecision(2)}`
		);
	const { t, y } = stepper.curve(x.points);
	if (!figuresWanted)
		return {
			step: { t, y, riseTime: null, overshoot: null, settlingTime: null, final: x.final },
			warning: null
		};
	if (samples * (x.finitePoles + 1) ** 2 > WORK)
		return {
			step: { t, y, riseTime: null, overshoot: null, settlingTime: null, final: x.final },
			warning: tooLong
		};
	const fig = stepper.figures(x.final!, x.tFast, ringing);
	if (!fig)
		return {
			step: { t, y, riseTime: null, overshoot: null, settlingTime: null, final: x.final },
			warning: {
				code: 'step_untrusted',
				message:
					'the rise time, overshoot and settling time are not shown: the response rings too long to follow to the end of the step'
			}
		};
	return { step: { t, y, ...fig, final: x.final }, warning: null };
}

/**
 * trustedStep over the default window 10/|Re p_slow|, doubled (at most three times) while the
 * response has not settled within it — a fourfold pole needs about 10.05 time constants to
 * settle to 1 %. A caller's own tEnd is kept as given. Still unsettled: a warning says so.
 */
export function stepInWindow(
	x: StepInputs,
	fixedEnd: boolean
): { step: Analysis['step']; warnings: Warning[] } {
	let tEnd = x.tEnd;
	let out = trustedStep(x);
	for (let k = 0; k < 3 && !fixedEnd && unsettled(out.step); k++) {
		tEnd *= 2;
		out = trustedStep({ ...x, tEnd });
	}
	const warnings = out.warning ? [out.warning] : [];
	if (unsettled(out.step))
		warnings.push({
			code: 'step_not_settled',
			message: `the step response has not settled within 1 % by the end of its window (${tEnd.toPrecision(3)} s); the settling time is not shown`
		});
	return { step: out.step, warnings };
}

const unsettled = (s: Analysis['step']) =>
	s !== null && s.final !== null && s.final !== 0 && s.riseTime !== null && s.settlingTime === null;
