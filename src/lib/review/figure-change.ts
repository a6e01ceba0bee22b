// How a figure changed between two revisions, said so a reviewer can trust it. A relative change
// needs a base far from zero: "≈ 0 → ≈ 0" read −817 % and a settling time that went to 0 read
// −100 %. So a change is relative only when both sides are clearly non-zero; otherwise it is
// the absolute difference in the figure's own unit; a figure present on one side only appears
// or disappears, in words.

export type FigureChange =
	| { kind: 'relative'; pct: number; absolute: number }
	| { kind: 'absolute'; absolute: number }
	| { kind: 'same' }
	| { kind: 'appears' }
	| { kind: 'disappears' }
	| { kind: 'none' };

/** Relative differences below this are the solver's round-off, not a change. */
const ROUND_OFF = 1e-9;

/**
 * Values whose magnitude is below `floor` are "at or near zero" (round-off of an exact zero):
 * 1e-9 for gains (the result panels' "≈ 0"), 1e-6 for a percentage, 0 for times and frequencies
 * (which are either a figure or absent).
 */
export function figureChange(before: number | null, after: number | null, floor = 0): FigureChange {
	const has = (v: number | null): v is number => v !== null && Number.isFinite(v);
	if (!has(before) && !has(after)) return { kind: 'none' };
	if (!has(before)) return { kind: 'appears' };
	if (!has(after)) return { kind: 'disappears' };
	const nearZero = (v: number) => Math.abs(v) <= floor;
	if (nearZero(before) && nearZero(after)) return { kind: 'same' };
	const absolute = after - before;
	// Round-off of an unchanged figure (1 → 1 + 5e-15) is no change, not "+5e-13 %".
	if (Math.abs(absolute) <= ROUND_OFF * Math.max(Math.abs(before), Math.abs(after)))
		return { kind: 'same' };
	if (nearZero(before) || nearZero(after) || Math.sign(before) !== Math.sign(after))
		return { kind: 'absolute', absolute };
	return { kind: 'relative', pct: (absolute / Math.abs(before)) * 100, absolute };
}

/** The floor below which a figure in `unit` counts as zero (see figureChange). */
export const zeroFloor = (unit: string) =>
	unit === '%' ? 1e-6 : unit === 'Hz' || unit === 's' ? 0 : 1e-9;
