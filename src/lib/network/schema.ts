import { z } from 'zod';
import { variantSetSchema } from './variant-schema';

/**
 * The network JSON document (schema 1), shared by the analysis route, the editor and the solver.
 * This checks shape only; meaning (values, node counts, references, loops) is checked by the
 * solver's `validateNetwork`, which reports each problem naming the element or node.
 */
export const ELEMENT_TYPES = [
	'R',
	'C',
	'L',
	'V',
	'I',
	'VCCS',
	'VCVS',
	'CCCS',
	'CCVS',
	'OPAMP'
] as const;

export type ElementType = (typeof ELEMENT_TYPES)[number];

export const elementSchema = z.object({
	id: z.string().min(1).max(64),
	type: z.enum(ELEMENT_TYPES),
	nodes: z
		.array(z.union([z.string().min(1).max(64), z.number().int()]))
		.min(2)
		.max(4),
	value: z.union([z.number(), z.string().max(40)]).optional(),
	control: z.string().min(1).max(64).optional()
});

export const networkDocumentSchema = z.object({
	schema: z.literal(1),
	title: z.string().max(200).optional(),
	elements: z.array(elementSchema).max(5000),
	input: z.string().min(1),
	output: z.object({
		node: z.union([z.string().min(1), z.number().int()]),
		reference: z.union([z.string().min(1), z.number().int()]).optional()
	}),
	/** Named override sets on this drawing (variant-schema.ts); absent: the drawing is the only variant. */
	variants: variantSetSchema.optional()
});

export type NetworkElement = z.infer<typeof elementSchema>;
export type NetworkDocument = z.infer<typeof networkDocumentSchema>;
