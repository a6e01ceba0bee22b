import { z } from 'zod';

/**
 * What a sheet keeps for its design aids, beside (not inside) the network document: the spec
 * limits its figures are judged against, and the tolerance of each element for tolerance runs.
 * All values are numbers in SI base units (the editor parses "10p" before it gets here);
 * overshoot is in percent and flatness in dB.
 */
const positive = (what: string) =>
	z
		.number({ error: `${what} must be a number` })
		.positive(`${what} must be above 0`)
		.finite();

export const specLimitsSchema = z
	.object({
		bandwidthMin: positive('minimum bandwidth').optional(),
		riseTimeMax: positive('maximum rise time').optional(),
		overshootMax: z.number().min(0, 'maximum overshoot cannot be negative').max(1000).optional(),
		flatness: z
			.object({
				withinDb: positive('flatness'),
				fLo: positive('band start'),
				fHi: positive('band end')
			})
			.refine((f) => f.fLo < f.fHi, {
				message: 'the flatness band must start below its end',
				path: ['fHi']
			})
			.optional(),
		dcGain: z
			.object({ min: z.number().finite().optional(), max: z.number().finite().optional() })
			.refine((g) => g.min === undefined || g.max === undefined || g.min <= g.max, {
				message: 'the DC gain range must run low to high',
				path: ['max']
			})
			.optional(),
		inputResistanceMin: positive('minimum input resistance').optional(),
		inputCapacitanceMax: positive('maximum input capacitance').optional(),
		/** Frequency at which the input capacitance is read, Hz. */
		inputCapacitanceAt: positive('input capacitance frequency').optional()
	})
	.strict();

export const DISTRIBUTIONS = ['uniform', 'normal', 'fixed'] as const;

export const elementToleranceSchema = z.object({
	element: z.string().min(1).max(64),
	/** Fraction: 0.01 is ±1 %. For "normal" it is 3σ. */
	tolerance: z
		.number()
		.min(0, 'a tolerance cannot be negative')
		.max(0.9, 'a tolerance above 90 % is not a component'),
	distribution: z.enum(DISTRIBUTIONS)
});

export const MONTE_CARLO_MAX_RUNS = 10_000;

export const toleranceSettingsSchema = z.object({
	elements: z.array(elementToleranceSchema).max(5000),
	runs: z
		.number()
		.int()
		.min(10, 'at least 10 runs')
		.max(MONTE_CARLO_MAX_RUNS, `at most ${MONTE_CARLO_MAX_RUNS} runs`)
		.default(1000),
	seed: z
		.number()
		.int()
		.min(0)
		.max(2 ** 32 - 1)
		.default(1)
});

/**
 * Specs that only make sense across a sheet's variants (docs/design-aids.md, "Specs across
 * variants"). `equal`: the figure is the same in every variant within `tolerance` (a fraction of
 * the smallest value) — across all variants, or, with `group`, across that group's options for
 * each choice of the other groups (every range position, per cable). `ratio`: within each choice
 * of the other groups, the figure of each listed option over that of the first listed is the
 * stated ratio within `tolerance` (attenuation steps 1 : 10 : 100).
 */
export const CROSS_FIGURES = [
	'dcGain',
	'attenuation',
	'bandwidth',
	'riseTime',
	'overshoot',
	'settlingTime',
	'inputResistance',
	'inputCapacitance'
] as const;
export type CrossFigure = (typeof CROSS_FIGURES)[number];

const tolerance = z
	.number({ error: 'the tolerance must be a number' })
	.positive('the tolerance must be above 0')
	.max(10, 'a tolerance above 1000 % says nothing');

export const crossSpecSchema = z.discriminatedUnion('kind', [
	z.object({
		kind: z.literal('equal'),
		figure: z.enum(CROSS_FIGURES),
		group: z.string().min(1).max(40).optional(),
		tolerance
	}),
	z.object({
		kind: z.literal('ratio'),
		figure: z.enum(CROSS_FIGURES),
		group: z.string().min(1).max(40),
		/** Option name → ratio; at least two options. */
		ratios: z
			.record(z.string().min(1).max(40), positive('a ratio'))
			.refine((r) => Object.keys(r).length >= 2, 'a ratio spec needs at least two options'),
		tolerance
	})
]);
export type CrossSpec = z.infer<typeof crossSpecSchema>;

export const designSettingsSchema = z.object({
	spec: specLimitsSchema.default({}),
	across: z.array(crossSpecSchema).max(20, 'at most 20 cross-variant specs').optional(),
	tolerances: toleranceSettingsSchema.default({ elements: [], runs: 1000, seed: 1 })
});

export type SpecLimits = z.infer<typeof specLimitsSchema>;
export type { CrossSpec as CrossVariantSpec };
export type ElementTolerance = z.infer<typeof elementToleranceSchema>;
export type ToleranceSettings = z.infer<typeof toleranceSettingsSchema>;
export type DesignSettings = z.infer<typeof designSettingsSchema>;
