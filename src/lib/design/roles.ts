// Part roles for the design aids (the network schema's `role`): which aid may change which part.
// A design value is the designer's to choose: snap, solve, sweep and tolerance runs all apply.
// A fixed value (a cable's capacitance, a parasitic, a source impedance) is given from outside:
// never snapped, solved or written, held at nominal in tolerance runs unless a tolerance is set
// for it; a sweep may still move it, as a what-if ("how far does the cable move the pole?").
// A trimmer is set by adjustment within its range: solving answers with its setting (and says
// when the answer is outside the range), a sweep runs over the range, it is not snapped to a
// preferred value (it has none) and is held at its setting in tolerance runs (it is trimmed).
import type { NetworkDocument, NetworkElement, PartRole } from '../network/schema';
import { parseValue } from '../solver/parse-value';
import { DesignError } from './errors';

const UNIT: Record<string, string | undefined> = { R: 'Ω', C: 'F', L: 'H', VCCS: 'S', CCVS: 'Ω' };

export const roleOf = (e: Pick<NetworkElement, 'role'>): PartRole => e.role ?? 'design';

const elementIn = (doc: NetworkDocument, id: string) => doc.elements.find((e) => e.id === id);

/** The trimmer's range in SI units, or null for other roles (or a range that does not read). */
export function trimRange(e: NetworkElement): { min: number; max: number } | null {
	if (roleOf(e) !== 'trimmer' || !e.range) return null;
	try {
		const min = parseValue(e.range.min, UNIT[e.type]);
		const max = parseValue(e.range.max, UNIT[e.type]);
		return min < max ? { min, max } : null;
	} catch {
		return null;
	}
}

const ROLE_WORDS: Record<PartRole, string> = {
	design: 'a design value',
	fixed: 'a fixed value (given from outside the design: a cable, a parasitic, a source)',
	trimmer: 'a trimmer'
};
export const roleWords = (role: PartRole) => ROLE_WORDS[role];

/** Solving may change design values and trimmers; a fixed part is refused, naming why. */
export function assertSolvable(doc: NetworkDocument, id: string): void {
	const e = elementIn(doc, id);
	if (e && roleOf(e) === 'fixed')
		throw new DesignError(
			'fixed_part',
			`"${id}" is ${ROLE_WORDS.fixed}: the design aids do not change it. Mark it as a design value or a trimmer to solve for it.`,
			{ element: id }
		);
}

/** Parts "snap to preferred values" may change: design values only. The rest, with the reason. */
export function snappable(doc: NetworkDocument): {
	parts: NetworkElement[];
	skipped: { id: string; why: string }[];
} {
	const parts: NetworkElement[] = [];
	const skipped: { id: string; why: string }[] = [];
	for (const e of doc.elements) {
		if (!['R', 'C', 'L'].includes(e.type)) continue;
		const role = roleOf(e);
		if (role === 'design') parts.push(e);
		else
			skipped.push({
				id: e.id,
				why: role === 'fixed' ? 'fixed value' : 'trimmer (set by adjustment)'
			});
	}
	return { parts, skipped };
}

/** Where a solved value sits on a trimmer: its setting as a share of the range, or out of range. */
export function trimmerSetting(
	e: NetworkElement,
	value: number
): { min: number; max: number; position: number; inRange: boolean } | null {
	const r = trimRange(e);
	if (!r) return null;
	const position = (Math.abs(value) - r.min) / (r.max - r.min);
	return { ...r, position, inRange: position >= 0 && position <= 1 };
}

/** The tolerance a run uses by default: fixed parts and trimmers stay at nominal. */
export function defaultDistribution(e: NetworkElement): 'uniform' | 'fixed' {
	return roleOf(e) === 'design' && (e.type === 'R' || e.type === 'C') ? 'uniform' : 'fixed';
}
