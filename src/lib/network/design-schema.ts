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

export const designSettingsSchema = z.object({
	spec: specLimitsSchema.default({}),
	tolerances: toleranceSettingsSchema.default({ elements: [], runs: 1000, seed: 1 })
});

export type SpecLimits = z.infer<typeof specLimitsSchema>;
export type ElementTolerance = z.infer<typeof elementToleranceSchema>;
export type ToleranceSettings = z.infer<typeof toleranceSettingsSchema>;
export type DesignSettings = z.infer<typeof designSettingsSchema>;
