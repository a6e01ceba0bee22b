import { elementOf, applyValues, prepareNetwork, type Prepared } from './prepared';
import { evaluate, naturalShift, type Evaluation, type EvaluateOptions } from './evaluate';

/**
 * One network opened for many evaluations: the prepared structure plus the reduction shift.
 * `adaptShift` lets a sweep carry the shift along with the poles (each point starts from the
 * geometric middle of the previous point's spectrum), which keeps every point at full accuracy
 * when a value moves over decades.
 */
export interface Variants {
	prepared: Prepared;
	shift: number;
	adaptShift: boolean;
}

export function openVariants(doc: unknown, { adaptShift = false } = {}): Variants {
	const prepared = prepareNetwork(doc);
	return { prepared, shift: naturalShift(prepared), adaptShift };
}

/** Evaluate with some elements (by id) at other values; all others at nominal. */
export function evaluateWith(
	v: Variants,
	values: Record<string, number>,
	opts: EvaluateOptions = {}
): Evaluation {
	const byIndex = new Map<number, number>();
	for (const [id, x] of Object.entries(values)) byIndex.set(elementOf(v.prepared, id).index, x);
	applyValues(v.prepared, byIndex);
	const result = evaluate(v.prepared, v.shift, opts);
	if (v.adaptShift && result.nextShift > 0 && Number.isFinite(result.nextShift))
		v.shift = result.nextShift;
	return result;
}

/** Nominal value (SI) of an adjustable element. */
export function nominalOf(v: Variants, id: string): number {
	return elementOf(v.prepared, id).nominal;
}
