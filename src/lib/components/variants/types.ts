import type { Analysis } from '$lib/solver';

/** One variant's outcome as the side-by-side views take it (the live answer or a stored one). */
export interface VariantRow {
	name: string;
	analysis: Analysis | null;
	error: { error: string } | null;
}
