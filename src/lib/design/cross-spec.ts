// The cross-variant specs judged on figures already computed: a figure equal within a tolerance,
// or in stated ratios between the options of a group. Pure and without solver code, so the
// browser can label and show them; variant-spec.ts computes the figures.
import type { VariantGroup } from '../network/variant-schema';
import type { CrossFigure, CrossSpec } from '../network/design-schema';
import { formatEngineering } from '../solver/format';
import type { Metrics } from './evaluate';
import { DEFAULT_CAPACITANCE_AT, type SpecOutcome } from './spec-limits';

export interface VariantJudged {
	name: string;
	options: string[];
	figures: Metrics | null;
	spec: SpecOutcome | null;
	error: string | null;
}

export interface CrossMember {
	variant: string;
	value: number | null;
	shown: string;
}

export interface CrossSet {
	/** What the set holds fixed ("2 m cable"), or "all variants". */
	within: string;
	members: CrossMember[];
	/** How far apart they are, in words ("spread 2.8 %, allowed 5 %"). */
	detail: string;
	pass: boolean;
}

export interface CrossOutcome {
	label: string;
	sets: CrossSet[];
	pass: boolean;
}

export interface VariantSpecOutcome {
	variants: VariantJudged[];
	across: CrossOutcome[];
	/** Every variant meets every limit and every cross-variant spec holds. */
	pass: boolean;
}

const LABEL: Record<CrossFigure, string> = {
	dcGain: 'DC gain',
	attenuation: 'Attenuation (1/|DC gain|)',
	bandwidth: '−3 dB bandwidth',
	riseTime: 'Rise time 10–90 %',
	overshoot: 'Step overshoot',
	settlingTime: 'Settling to 1 %',
	inputResistance: 'Input resistance (DC)',
	inputCapacitance: 'Input capacitance'
};
const UNIT: Record<CrossFigure, string> = {
	dcGain: '',
	attenuation: '',
	bandwidth: 'Hz',
	riseTime: 's',
	overshoot: '%',
	settlingTime: 's',
	inputResistance: 'Ω',
	inputCapacitance: 'F'
};

export function figureOf(m: Metrics | null, f: CrossFigure): number | null {
	if (!m) return null;
	if (f === 'attenuation') return m.dcGain ? 1 / Math.abs(m.dcGain) : null;
	const v = m[f];
	return typeof v === 'number' && Number.isFinite(v) ? v : null;
}

const show = (v: number | null, f: CrossFigure) =>
	v === null
		? 'not defined'
		: f === 'dcGain' || f === 'attenuation'
			? String(Number(v.toPrecision(6)))
			: formatEngineering(v, UNIT[f], 4);
const percent = (x: number) => `${Number((x * 100).toPrecision(3))} %`;

export function crossLabel(c: CrossSpec, capacitanceAt = DEFAULT_CAPACITANCE_AT): string {
	const fig =
		c.figure === 'inputCapacitance'
			? `${LABEL[c.figure]} at ${formatEngineering(capacitanceAt, 'Hz')}`
			: LABEL[c.figure];
	if (c.kind === 'equal')
		return `${fig} equal ${c.group ? `across ${c.group}` : 'in every variant'}, within ${percent(c.tolerance)}`;
	const steps = Object.entries(c.ratios).sort((a, b) => a[1] - b[1]);
	return `${fig} in the ratio ${steps.map(([, r]) => String(r)).join(' : ')} across ${c.group} (${steps.map(([o]) => o).join(', ')}), within ${percent(c.tolerance)}`;
}

/** Variants grouped by the options of every group but `g` (g = -1: one set of all). */
function setsOf(
	variants: VariantJudged[],
	g: number
): { within: string; members: VariantJudged[] }[] {
	const out = new Map<string, VariantJudged[]>();
	for (const v of variants) {
		const key = g < 0 ? '' : v.options.filter((_, i) => i !== g).join(' · ');
		out.set(key, [...(out.get(key) ?? []), v]);
	}
	return [...out].map(([key, members]) => ({ within: key || 'all variants', members }));
}

/** Judge the cross-variant specs on variants whose figures are known (or null with a reason). */
export function checkAcross(
	groups: Pick<VariantGroup, 'name'>[],
	variants: VariantJudged[],
	across: CrossSpec[],
	capacitanceAt = DEFAULT_CAPACITANCE_AT
): CrossOutcome[] {
	return across.map((c) => {
		const label = crossLabel(c, capacitanceAt);
		const g = c.group === undefined ? -1 : groups.findIndex((x) => x.name === c.group);
		if (c.group !== undefined && g < 0)
			return {
				label,
				pass: false,
				sets: [
					{
						within: '—',
						members: [],
						detail: `the sheet has no variant group “${c.group}”`,
						pass: false
					}
				]
			};
		const sets = setsOf(variants, g).flatMap(({ within, members }) => {
			const inSpec =
				c.kind === 'ratio' ? members.filter((m) => c.ratios[m.options[g]] !== undefined) : members;
			if (inSpec.length < 2) return [];
			const list = inSpec.map((m) => {
				const value = figureOf(m.figures, c.figure);
				return {
					variant: m.name,
					option: g >= 0 ? m.options[g] : m.name,
					value,
					shown: m.error ? `not analysed (${m.error})` : show(value, c.figure)
				};
			});
			const missing = list.find((m) => m.value === null);
			const members_ = list.map(({ variant, value, shown }) => ({ variant, value, shown }));
			if (missing)
				return [
					{
						within,
						members: members_,
						detail: `${missing.variant} has no ${LABEL[c.figure].toLowerCase()}`,
						pass: false
					}
				];
			const values = list.map((m) => m.value!);
			if (c.kind === 'equal') {
				const lo = Math.min(...values.map(Math.abs));
				const spread = (Math.max(...values) - Math.min(...values)) / (lo || 1);
				const pass = spread <= c.tolerance;
				return [
					{
						within,
						members: members_,
						detail: `spread ${percent(spread)}, allowed ${percent(c.tolerance)}`,
						pass
					}
				];
			}
			// Ratios relative to the option with the smallest stated ratio.
			const ref = list.reduce((a, b) => (c.ratios[b.option] < c.ratios[a.option] ? b : a));
			const worst = list
				.filter((m) => m !== ref)
				.map((m) => {
					const want = c.ratios[m.option] / c.ratios[ref.option];
					const got = m.value! / ref.value!;
					return { m, want, got, off: Math.abs(got / want - 1) };
				})
				.reduce((a, b) => (b.off > a.off ? b : a));
			const pass = worst.off <= c.tolerance;
			return [
				{
					within,
					members: members_,
					detail: `${worst.m.option} : ${ref.option} is ${Number(worst.got.toPrecision(5))} against ${Number(worst.want.toPrecision(5))} (off by ${percent(worst.off)}, allowed ${percent(c.tolerance)})`,
					pass
				}
			];
		});
		if (sets.length === 0)
			return {
				label,
				pass: false,
				sets: [
					{ within: '—', members: [], detail: 'fewer than two variants to compare', pass: false }
				]
			};
		return { label, sets, pass: sets.every((s) => s.pass) };
	});
}
