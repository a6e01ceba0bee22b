import { z } from 'zod';
import { ELEMENT_LIMIT } from './limits';
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

/**
 * What a part's value is to the designer (issue 16). `design` (the default when absent): a value
 * the designer chooses and may change — snapping, solving, sweeping and tolerances apply.
 * `fixed`: given by something outside the design (a cable's capacitance, a parasitic, a source
 * impedance) — never snapped, solved or written by a design aid. `trimmer`: set by adjustment
 * within `range`; solving answers with its setting and says when it falls outside the range.
 */
export const PART_ROLES = ['design', 'fixed', 'trimmer'] as const;
export type PartRole = (typeof PART_ROLES)[number];

const valueSchema = z.union([z.number(), z.string().max(40)]);

export const elementSchema = z.object({
	id: z.string().min(1).max(64),
	type: z.enum(ELEMENT_TYPES),
	nodes: z
		.array(z.union([z.string().min(1).max(64), z.number().int()]))
		.min(2)
		.max(4),
	value: valueSchema.optional(),
	control: z.string().min(1).max(64).optional(),
	role: z.enum(PART_ROLES).optional(),
	/** A trimmer's adjustment range, in the element's own unit (read like `value`). */
	range: z.object({ min: valueSchema, max: valueSchema }).optional()
});

/**
 * Node names are the nets' names, one naming everywhere: the editor keeps them stable across
 * edits, shows and renames them on the canvas, and every picker, export, comment anchor and
 * report uses these strings. `gnd` (alias `0`) is the reference node.
 */
export const networkDocumentSchema = z.object({
	schema: z.literal(1),
	title: z.string().max(200).optional(),
	elements: z.array(elementSchema).max(ELEMENT_LIMIT),
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
