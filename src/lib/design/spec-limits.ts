import type { Analysis } from '../solver/types';
import type { SpecLimits } from '../network/design-schema';
import type { EvaluateOptions, Metrics } from './evaluate';
import { formatEngineering } from '../solver/format';

export type { SpecLimits };

/** One line of a pass/fail table. `pass` is false when the figure does not exist (e.g. no −3 dB point). */
export interface SpecCheck {
	key: string;
	label: string;
	limit: string;
	value: number | null;
	shown: string;
	pass: boolean;
}

export interface SpecOutcome {
	pass: boolean;
	checks: SpecCheck[];
}

export type SpecFigures = Pick<
	Metrics,
	| 'bandwidth'
	| 'riseTime'
	| 'overshoot'
	| 'flatnessDb'
	| 'dcGain'
	| 'inputResistance'
	| 'inputCapacitance'
>;

export const DEFAULT_CAPACITANCE_AT = 1e6;

/** What the evaluator must compute to judge these limits (band, input impedance frequency). */
export function optionsFor(spec: SpecLimits): EvaluateOptions {
	return {
		band: spec.flatness ? { fLo: spec.flatness.fLo, fHi: spec.flatness.fHi } : null,
		inputAt:
			spec.inputResistanceMin || spec.inputCapacitanceMax
				? (spec.inputCapacitanceAt ?? DEFAULT_CAPACITANCE_AT)
				: undefined
	};
}

const fmt = (x: number | null, unit: string) =>
	x === null ? 'not defined' : formatEngineering(x, unit);

export function checkSpec(spec: SpecLimits, m: SpecFigures): SpecOutcome {
	const checks: SpecCheck[] = [];
	const add = (
		key: string,
		label: string,
		limit: string,
		value: number | null,
		unit: string,
		ok: (v: number) => boolean
	) =>
		checks.push({
			key,
			label,
			limit,
			value,
			shown: fmt(value, unit),
			pass: value !== null && !Number.isNaN(value) && ok(value)
		});
	if (spec.bandwidthMin !== undefined)
		add(
			'bandwidth',
			'Bandwidth (−3 dB)',
			`≥ ${fmt(spec.bandwidthMin, 'Hz')}`,
			m.bandwidth,
			'Hz',
			(v) => v >= spec.bandwidthMin!
		);
	if (spec.riseTimeMax !== undefined)
		add(
			'riseTime',
			'Rise time 10–90 %',
			`≤ ${fmt(spec.riseTimeMax, 's')}`,
			m.riseTime,
			's',
			(v) => v <= spec.riseTimeMax!
		);
	if (spec.overshootMax !== undefined) {
		add(
			'overshoot',
			'Step overshoot',
			`≤ ${spec.overshootMax} %`,
			m.overshoot,
			'%',
			(v) => v <= spec.overshootMax!
		);
	}
	if (spec.flatness) {
		const f = spec.flatness;
		add(
			'flatness',
			`Flatness ${fmt(f.fLo, 'Hz')}–${fmt(f.fHi, 'Hz')}`,
			`within ±${f.withinDb} dB`,
			m.flatnessDb,
			'dB',
			(v) => v <= f.withinDb
		);
	}
	if (spec.dcGain && (spec.dcGain.min !== undefined || spec.dcGain.max !== undefined)) {
		const { min, max } = spec.dcGain;
		const limit =
			min !== undefined && max !== undefined
				? `${min} to ${max}`
				: min !== undefined
					? `≥ ${min}`
					: `≤ ${max}`;
		add(
			'dcGain',
			'DC gain',
			limit,
			m.dcGain,
			'',
			(v) => (min === undefined || v >= min) && (max === undefined || v <= max)
		);
	}
	if (spec.inputResistanceMin !== undefined) {
		add(
			'inputResistance',
			'Input resistance (DC)',
			`≥ ${fmt(spec.inputResistanceMin, 'Ω')}`,
			m.inputResistance,
			'Ω',
			(v) => v >= spec.inputResistanceMin!
		);
	}
	if (spec.inputCapacitanceMax !== undefined) {
		const at = spec.inputCapacitanceAt ?? DEFAULT_CAPACITANCE_AT;
		add(
			'inputCapacitance',
			`Input capacitance at ${fmt(at, 'Hz')}`,
			`≤ ${fmt(spec.inputCapacitanceMax, 'F')}`,
			m.inputCapacitance,
			'F',
			(v) => v <= spec.inputCapacitanceMax!
		);
	}
	return { pass: checks.every((c) => c.pass), checks };
}

/**
 * The same figures read from a full Analysis (what the sheet page already has). Flatness and
 * input capacitance come from its sampled responses, interpolated in log f — good to the
 * sampling; the design aids' own evaluator computes them exactly from the pole–zero form.
 */
export function figuresOfAnalysis(a: Analysis, spec: SpecLimits): SpecFigures {
	let flatnessDb: number | null = null;
	const fr = a.frequencyResponse;
	if (spec.flatness && fr && a.dcGain) {
		const ref = 20 * Math.log10(Math.abs(a.dcGain));
		let worst = 0;
		let seen = 0;
		fr.f.forEach((f, i) => {
			const m = fr.magnitudeDb[i];
			if (m === null || f < spec.flatness!.fLo || f > spec.flatness!.fHi) return;
			worst = Math.max(worst, Math.abs(m - ref));
			seen++;
		});
		flatnessDb = seen ? worst : null;
	}
	let inputCapacitance: number | null = null;
	const zin = a.inputImpedance;
	if (spec.inputCapacitanceMax !== undefined && zin && zin.f.length > 1) {
		const at = spec.inputCapacitanceAt ?? DEFAULT_CAPACITANCE_AT;
		const i = zin.f.findIndex((f) => f >= at);
		if (i > 0) {
			const t = Math.log(at / zin.f[i - 1]) / Math.log(zin.f[i] / zin.f[i - 1]);
			const lerp = (u: number | null, v: number | null) =>
				u === null || v === null ? null : u + (v - u) * t;
			const mag = lerp(zin.magnitude[i - 1], zin.magnitude[i]);
			const ph = lerp(zin.phaseDeg[i - 1], zin.phaseDeg[i]);
			if (mag && ph !== null)
				inputCapacitance = Math.sin((-ph * Math.PI) / 180) / (mag * 2 * Math.PI * at);
		}
	}
	return {
		bandwidth: a.bandwidth,
		riseTime: a.step?.riseTime ?? null,
		overshoot: a.step?.overshoot ?? null,
		flatnessDb,
		dcGain: a.dcGain,
		inputResistance: a.inputImpedance?.dc ? a.inputImpedance.dc.re : null,
		inputCapacitance
	};
}

export const isEmptySpec = (s: SpecLimits) => checkSpec(s, {} as SpecFigures).checks.length === 0;
