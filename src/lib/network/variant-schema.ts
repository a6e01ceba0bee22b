import { z } from 'zod';

/**
 * Variants of one sheet (docs/network-format.md, "Variants"): named override sets on the base
 * drawing, organised in groups whose options combine — a range switch with three positions and
 * a cable with two options make six variants. Shape only; references to elements and the
 * conflicts between groups are checked by `listVariants` in variants.ts, which names the option
 * and the element at fault.
 */

import { VARIANT_JOIN, VARIANT_LIMITS } from './variant-limits';

export { VARIANT_JOIN, VARIANT_LIMITS };

const name = (what: string) =>
	z
		.string({ error: `${what} must be text` })
		.trim()
		.min(1, `${what} is empty`)
		.max(
			VARIANT_LIMITS.nameLength,
			`${what} is too long (at most ${VARIANT_LIMITS.nameLength} characters)`
		)
		.refine((s) => !s.includes('·'), `${what} may not contain “·” (it joins option names)`);

const elementId = z.string().min(1).max(64);

export const variantOptionSchema = z.object({
	name: name('an option name'),
	/** Element id → value in this option (a number in SI units or text such as "6.2p"). */
	values: z.record(elementId, z.union([z.number(), z.string().max(40)])).optional(),
	/** Parts that are not in the network in this option. */
	absent: z.array(elementId).max(5000).optional(),
	/** Parts absent in the base (`variants.absent`) that this option puts in. */
	present: z.array(elementId).max(5000).optional()
});

export const variantGroupSchema = z.object({
	name: name('a group name'),
	options: z
		.array(variantOptionSchema)
		.min(1, 'a group needs at least one option')
		.max(VARIANT_LIMITS.options, `a group has at most ${VARIANT_LIMITS.options} options`)
});

export const variantSetSchema = z.object({
	/** Parts drawn on the sheet but absent from the base network (an option may make them present). */
	absent: z.array(elementId).max(5000).optional(),
	groups: z
		.array(variantGroupSchema)
		.max(VARIANT_LIMITS.groups, `at most ${VARIANT_LIMITS.groups} variant groups`)
});

export type VariantOption = z.infer<typeof variantOptionSchema>;
export type VariantGroup = z.infer<typeof variantGroupSchema>;
export type VariantSet = z.infer<typeof variantSetSchema>;
