// Request bodies of the design-aid API. The network document itself is checked by the same
// front door as POST /api/analyze (element limit, shape, the element at fault named).
import { z } from 'zod';
import {
	elementToleranceSchema,
	specLimitsSchema,
	crossSpecSchema,
	MONTE_CARLO_MAX_RUNS
} from '$lib/network/design-schema';
import { SERIES } from '$lib/design/preferred-values';
import { SWEEP_LIMITS } from '$lib/design/sweep';

const value = (what: string) => z.number({ error: `${what} must be a number` }).finite();
const positive = (what: string) => value(what).positive(`${what} must be above 0`);
const band = z
	.object({ fLo: positive('fLo'), fHi: positive('fHi') })
	.refine((b) => b.fLo < b.fHi, { message: 'the band must start below its end', path: ['fHi'] });

export const sweepBody = z.object({
	document: z.unknown(),
	axes: z
		.array(
			z.object({
				element: z.string().min(1),
				from: value('from'),
				to: value('to'),
				points: z.number().int().min(2).max(SWEEP_LIMITS.pointsPerAxis),
				scale: z.enum(['linear', 'log']).default('log')
			})
		)
		.min(1, 'sweep at least one element')
		.max(2, 'sweep at most two elements'),
	band: band.nullish(),
	inputAt: positive('inputAt').nullish()
});

export const goalSchema = z.discriminatedUnion('kind', [
	z.object({ kind: z.literal('flat'), band: band.optional() }),
	z.object({ kind: z.literal('bandwidth'), target: positive('target bandwidth') }),
	z.object({ kind: z.literal('q'), target: positive('target Q') }),
	z.object({ kind: z.literal('overshoot'), target: value('target overshoot').min(0) }),
	z.object({ kind: z.literal('dcGain'), target: value('target DC gain') })
]);

export const solveBody = z.object({
	document: z.unknown(),
	element: z.string().min(1),
	goal: goalSchema,
	range: z.object({ from: positive('range.from'), to: positive('range.to') }).optional(),
	series: z.enum(SERIES).optional()
});

export const documentBody = z.object({ document: z.unknown() });

export const worstCaseBody = z.object({
	document: z.unknown(),
	tolerances: z
		.array(elementToleranceSchema)
		.min(1, 'give at least one element a tolerance')
		.max(5000),
	method: z.enum(['corners', 'sensitivity']).default('sensitivity'),
	spec: specLimitsSchema.optional()
});

export const specBody = z.object({ document: z.unknown(), spec: specLimitsSchema });

/** Every variant against the limits, and the cross-variant specs (docs/design-aids.md). */
export const variantSpecBody = z.object({
	document: z.unknown(),
	spec: specLimitsSchema.default({}),
	across: z.array(crossSpecSchema).max(20).default([])
});

export const monteCarloBody = z.object({
	sheetId: z.uuid('sheetId must be a sheet id'),
	/** The revision to run on; with `document`, the saved revision that drawing started from. */
	revision: z.number().int().min(1).optional(),
	/** The drawing as it is now (unsaved edits), run instead of the stored revision's network. */
	document: z.unknown().optional(),
	runs: z
		.number()
		.int()
		.min(10)
		.max(MONTE_CARLO_MAX_RUNS, `at most ${MONTE_CARLO_MAX_RUNS} runs`)
		.optional(),
	seed: z
		.number()
		.int()
		.min(0)
		.max(2 ** 32 - 1)
		.optional(),
	tolerances: z.array(elementToleranceSchema).max(5000).optional(),
	spec: specLimitsSchema.optional()
});
